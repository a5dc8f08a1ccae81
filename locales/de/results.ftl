# transit-parallax: Meldungen (results) auf Deutsch. DURCHSICHT NÖTIG: braucht die Durchsicht durch Muttersprachler (translations want a native speaker's review).

## Die öffentliche Ergebnisseite (/results)

results-title = Ergebnisse: die Sonnenparallaxe bis jetzt
results-not-determined = Die Sonnenparallaxe und die Astronomische Einheit sind noch nicht bestimmt: { $why }.
results-no-timing-reduced = es wurde noch keine Zeit reduziert
results-no-timings-arrived = es sind noch keine Zeiten eingegangen
results-first-being-computed = die erste Lösung wird berechnet
results-parallax = Sonnenparallaxe
results-au = Astronomische Einheit
results-timings-used = verwendete Zeiten
results-used-of = { $used } von { $total }
results-au-value = { $au } ± { $sigma } Millionen km (95 %: { $lo } bis { $hi } Millionen km)
results-au-value-open = { $au } ± { $sigma } Millionen km (95 %: ab { $lo } Millionen km, nach oben offen)
results-au-not-given = nicht angegeben: der Ein-Sigma-Bereich der Parallaxe reicht bis null, die Zeiten setzen ihr also keine obere Grenze
results-parallax-not-determined = Die Sonnenparallaxe ist noch nicht bestimmt und damit auch nicht die Astronomische Einheit: { $why }.
results-default-why = die geltenden Zeiten bestimmen sie nicht
results-need-two-none = Nötig sind Zeiten von mindestens zwei weit voneinander entfernten Stationen; noch keine Station hat brauchbare gesendet.
results-need-two-one = Nötig sind Zeiten von mindestens zwei weit voneinander entfernten Stationen; bisher hat eine Station brauchbare gesendet.
results-counts = Stationen: { $stations }; geltende Zeiten: { $timings }; Einsendungen: { $submissions }.
results-stations-heading = Die Stationen
results-map-caption = Die Stationen, jede an ihrem auf 0,1 Grad gerundeten Ort.
results-col-station = Station
results-col-latitude = Breite (0,1°)
results-col-longitude = Länge (0,1°)
results-col-timings = verwendete Zeiten
results-col-share = Anteil an der Information
results-share-not-determined = nicht bestimmt
results-share-none = keiner
results-convergence-heading = Wie die Lösung konvergierte
results-convergence-caption = Die Sonnenparallaxe und ihre Unsicherheit, während die Zeiten hinzukommen.
results-convergence-older = Für eine frühere Version der Daten gezeichnet ({ $version }); die neueste wird gezeichnet.
results-links = <a href="/register">Eine Station anmelden</a> · <a href="/">Ihre Zeiten senden</a>

## Der Satz „Stand“

as-of-none = Es wurde noch keine Lösung berechnet
as-of-solution = Lösung mit Stand { $when } UTC (Version { $version } der Daten)
as-of-settled = { $solution }; sie enthält jede eingegangene Zeit.
as-of-pending = { $solution }; { $n ->
    [one] 1 neuere Änderung (eine Einsendung, Korrektur oder ein Ausschluss) wird reduziert.
   *[other] { $n } neuere Änderungen (Einsendungen, Korrekturen oder Ausschlüsse) werden reduziert.
  }

## Die Diagramme der Ergebnisseite

chart-map-title = Weltkarte der Stationen
chart-map-not-used = { $station } (Nr. { $number }): nicht verwendet: { $why }
chart-map-station = { $station } (Nr. { $number }): Anteil { $share }, mittleres z { $z }
chart-map-colour-key = Farbe: Mittel von (O - C)/σ
chart-map-area-key = Fläche: Anteil an der Information
chart-convergence-title = Konvergenz der Sonnenparallaxe
chart-convergence-too-few = Zu wenige Zeiten, um der Lösung beim Hinzufügen zu folgen.
chart-convergence-timings-axis = Zeiten in der Lösung (in der Reihenfolge der Datei)
chart-convergence-zoomed = Sonnenparallaxe (Bogensekunden), vergrößert um den Endwert ± { $sigmas } Unsicherheiten
chart-convergence-iau = IAU-2009-Wert { $value }"
chart-convergence-off-above = { $label } oberhalb, außerhalb dieser Skala
chart-convergence-off-below = { $label } unterhalb, außerhalb dieser Skala
chart-convergence-sigma-axis = Ihre Standardunsicherheit (Bogensekunden, logarithmische Skala)
chart-convergence-point = { $timings } Zeiten: { $parallax }" ± { $sigma }"
chart-convergence-dashed = gestrichelt: Abfall wie 1/√N zum Endwert
