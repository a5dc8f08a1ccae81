# transit-parallax: Meldungen (sheet) auf Deutsch. DURCHSICHT NÖTIG: braucht die Durchsicht durch Muttersprachler (translations want a native speaker's review).
# Das Beobachtungsblatt (`predict --sheets`, das Blatt einer beim Dienst angemeldeten Station) und sein Kalender.
# Meldungen, deren Kennung auf -html endet, sind HTML und werden so geschrieben, wie sie stehen
# (Tags und Entitäten behalten). $planet ist venus oder mercury; $n ist eine Anzahl (sie wählt
# die Pluralform); Zahlen und Daten kommen schon für die Sprache geschrieben; Uhrzeiten
# bleiben im 24-Stunden-Format.

## Der Kopf

sheet-title =
    { $planet ->
        [venus] Venustransit
       *[other] Merkurtransit
    }, { $date }: { $station }
sheet-station-html = Station: <b>{ $station }</b>, Breite { $latitude }°, Länge { $longitude }° (östlich positiv), Höhe { $elevation } m.
sheet-zone-html = Uhrzeiten in <b>{ $zone }</b>: { $abbreviation } (UTC{ $offset }) während des Transits; daneben UTC.
sheet-no-zone-html = Für diese Station wurde keine Zeitzone angegeben, daher stehen die Zeiten <b>nur in UTC</b> da. Um sie in der Zeit Ihrer Uhr zu erhalten, rufen Sie <code>predict</code> noch einmal mit <code>--time-zone ZONE</code> auf (z. B. <code>Europe/Berlin</code> oder <code>+05:30</code>) oder ergänzen Sie die Stationsdatei um eine Spalte <code>time_zone</code>.

## Die vier Kontakte

sheet-contacts-heading = Die vier Kontakte
sheet-col-contact = Kontakt
sheet-col-your-clock = Ihre Uhr
sheet-col-sun-altitude = Sonnen{ "\u00AD" }höhe
sheet-col-sun-azimuth = Sonnen{ "\u00AD" }azimut
sheet-col-position-angle = Positions{ "\u00AD" }winkel
sheet-col-vertex-angle = Vertex{ "\u00AD" }winkel
sheet-col-seen = Sichtbar?
sheet-no-such-contact = dieser Kontakt findet an dieser Station nicht statt (streifender Transit)
sheet-seen-yes = ja, Sonne oben
sheet-seen-no = nein, unter Horizont
sheet-contacts-note = Die Zeiten sind auf die Sekunde gerundet. Es sind die idealen geometrischen Kontakte (I, II: Eintritt außen und innen; III, IV: Austritt innen und außen), aus der Ephemeride auf ±{ $sigma } s vorhergesagt, mit Delta T { $delta_t } s (siehe Fuß der Seite); was Sie sehen, kann um einige Sekunden abweichen (Tropfenphänomen, Luftunruhe, Ihre Uhr). Höhe: wahre Höhe der Sonnenmitte (ohne Refraktion); Azimut von Norden über Osten. Sichtbar: der obere Sonnenrand über dem Horizont (wahre Höhe über −0°50′).

## Sonnenaufgang und Sonnenuntergang

sheet-sun-heading = Sonnenaufgang und -untergang:
sheet-sun-up-throughout = Die Sonne bleibt während des ganzen Transits über dem Horizont.
sheet-sun-down-throughout = Die Sonne steht während des ganzen Transits unter dem Horizont: Von hier ist nichts davon zu sehen.
sheet-sun-rises-html = Die Sonne geht während des Transits auf, um { $time }.
sheet-sun-sets-html = Die Sonne geht während des Transits unter, um { $time }.
sheet-sun-note = (oberer Rand am Horizont, Standardhöhe −0°50′, Meeus Kap. 15; die Höhe der Station nicht berücksichtigt)

## Wo am Sonnenrand hinzusehen ist

sheet-drawings-heading = Wo am Sonnenrand Sie hinsehen sollten
sheet-zenith-caption-1 = Am Himmel: Zenit oben
sheet-zenith-caption-2 = (Vertexwinkel)
sheet-north-caption-1 = Äquatorial: Norden oben,
sheet-north-caption-2 = Osten links (Positionswinkel)
sheet-drawings-note = Der Positionswinkel wird vom Nordpunkt der Scheibe über Osten gezählt, der Vertexwinkel vom zenitnächsten Punkt über Osten; beide hier gegen den Uhrzeigersinn, wie man den Himmel direkt sieht. Ein Zenitspiegel spiegelt das Bild, ein Projektionsschirm kann es spiegeln oder drehen: Prüfen Sie vor dem Transit, in welche Richtung die Sonne wandert.
limb-zenith-label = Sonnenscheibe, wie sie am Himmel steht, Zenit oben
limb-north-label = Sonnenscheibe, Norden oben, Osten links
limb-zenith = Zenit
limb-north = N
limb-east = O

## Die leere Tabelle für die Zeiten

sheet-timings-heading = Ihre Zeiten
sheet-col-clock-time = Uhrzeit (hh:mm:ss.s)
sheet-col-zone = Zone oder Versatz
sheet-col-sure-html = Sicher auf&nbsp;±&nbsp;s
sheet-col-observer = Beobachter
sheet-col-what-seen = Was Sie sahen (Tropfen, Wolken)
sheet-fill-observers = Beobachter:
sheet-fill-instrument = Instrument, Öffnung (mm), Filter oder Projektion:
sheet-fill-clock = Uhr gestellt nach (GPS, Funk, Telefon), ihr Fehler:
sheet-reduce-note-html = Für <code>reduce</code> übertragen Sie jede Zeile in eine Beobachtungsdatei (<code>transit-parallax template observations</code>): contact, time_utc (oder die Uhrzeit mit ihrem Versatz, 2032-11-13T07:43:40.5+01:00), sigma_s (wie sicher) und observer.

## Der Fuß der Seite

sheet-calendar-empty = Keiner der Kontakte ist von hier bei Sonne über dem Horizont zu sehen, daher enthält der Kalender { $file } keine Termine.
sheet-calendar-holds =
    Der Kalender { $file } enthält { $n ->
        [one] den Kontakt
       *[other] die { $n } Kontakte
    }, die bei Sonne über dem Horizont zu sehen sind, mit Erinnerungen.
sheet-computed = Berechnet von transit-parallax { $version } mit der Ephemeride { $ephemeris }; Delta T { $delta_t } s.

## Delta T

sheet-delta-t-fixed-value = { $value }, fest
sheet-delta-t-fixed = Delta T mit --delta-t festgelegt.
sheet-delta-t-from = Delta T aus { $source }.
sheet-delta-t-source-leap-seconds = der Schaltsekundentabelle und dem angegebenen DUT1
sheet-delta-t-source-reconstruction = der Rekonstruktion von Morrison, Stephenson, Hohenkerk und Zawilski (2021)
sheet-delta-t-source-observed = Beobachtungen des IERS
sheet-delta-t-source-predicted = Vorhersagen des IERS Bulletin A
sheet-delta-t-source-extrapolated = einer Extrapolation: der Mitte dreier veröffentlichter Vorhersagen, mit der halben Spannweite als Unsicherheit
sheet-times-utc-hardly = Die Zeiten sind UTC; die Unsicherheit von Delta T verschiebt die Kontakte kaum.
sheet-times-ut1 = Die Zeiten sind UT1, also TT - Delta T: Ein Fehler in Delta T verschiebt jede gedruckte Zeit um etwa ebenso viel.
sheet-times-utc = Die Zeiten sind UTC.
sheet-times-utc-held = Die Zeiten sind UTC, mit TAI - UTC auf dem letzten Wert gehalten und so an TT gebunden: Ein Fehler in Delta T verschiebt sie nur über die Erddrehung während des Ereignisses (Sekunden für Minuten von Delta T), die UT1 jedes Kontakts und jede künftige Schaltsekunde aber um den ganzen Fehler.

## Der Kalender (.ics)

calendar-summary =
    { $planet ->
        [venus] Venustransit
       *[other] Merkurtransit
    }: Kontakt { $contact } ({ $station })
calendar-clock-time = Uhrzeit { $time } ({ $abbreviation }).
calendar-description =
    Kontakt { $contact } des { $planet ->
        [venus] Venustransits
       *[other] Merkurtransits
    } in { $station }: { $clock }UTC { $utc }. Sonnenhöhe { $altitude } Grad, Positionswinkel { $position_angle }, Vertexwinkel { $vertex_angle }.
calendar-reminder =
    Kontakt { $contact } des { $planet ->
        [venus] Venustransits
       *[other] Merkurtransits
    } in { $n } Minuten
