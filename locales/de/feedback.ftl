# transit-parallax: Meldungen (feedback) auf Deutsch. DURCHSICHT NÖTIG: braucht die Durchsicht durch Muttersprachler (translations want a native speaker's review).

## Der Unterschied eines gestoppten Intervalls zu seiner Vorhersage

later-than-predicted-interval = { $size } länger als das vorhergesagte Intervall
earlier-than-predicted-interval = { $size } kürzer als das vorhergesagte Intervall

## Was der Unterschied einer Zeit bedeutet

feedback-fits = { $diff }: innerhalb dessen, was die Unsicherheit Ihrer Zeit zulässt
feedback-probably = { $diff }: wahrscheinlich { $blunder }
feedback-more-than-stated = { $diff }: mehr, als Ihre angegebene Unsicherheit ({ $sigma } s) zulässt
feedback-far-off = { $diff }: weit mehr als jeder Fehler der Vorhersage oder einer Uhr
feedback-outside-years = der Zeitpunkt liegt außerhalb der Jahre, die das Werkzeug abdeckt
feedback-contact-not-seen = Ihre Station sieht den Kontakt { $contact } dieses Durchgangs nicht (die Bahn des Planeten verfehlt von dort aus gesehen diesen Kreis)
feedback-interval-not-seen = Ihre Station sieht das Intervall { $interval } dieses Durchgangs nicht
feedback-sun-down = die Sonne stand bei diesem Kontakt an Ihrer Station { $degrees } Grad unter dem Horizont
feedback-part-of-offset = { $diff }: Teil des Versatzes, den alle Ihre Zeiten teilen, wahrscheinlich { $cause } (oben einmal gesagt); ohne ihn liegt diese Zeit { $rest } s von ihrer Vorhersage
feedback-submission-unread = die Einsendung konnte nicht als Zeiten gelesen werden
feedback-row-unread = die Zeile kann nicht gelesen werden
unread-time-quoted = die Zeit „{ $time }“ konnte nicht als Datum und Uhrzeit gelesen werden
unread-time = eine Zeit konnte nicht als Datum und Uhrzeit gelesen werden

## Die Versehen einer Zeit (was die Reduktion selbst findet)

blunder-date-off = die Zeit liegt { $oc } s von ihrer Vorhersage, bis auf { $miss } s genau ein Tag: das Datum ist wahrscheinlich um einen Tag verschoben ({ $late ->
    [yes] einen Tag zu spät
   *[no] einen Tag zu früh
  })
blunder-half-day = der Unterschied beträgt { $hours } h, einen halben Tag: wahrscheinlich wurden bürgerliche und astronomische Tageszählung verwechselt (ein astronomischer Tag beginnt mittags: astronomisch 3. Juni, 21 h ist bürgerlich 4. Juni, 9 h; setzen Sie day_reckoning auf { $late ->
    [yes] civil, wenn die Zeilen astronomisch sagen
   *[no] astronomical, wenn die Zeilen bürgerlich sagen
  }), oder vormittags und nachmittags auf einer modernen Uhr
blunder-zone-hours = der Unterschied beträgt { $hours } h, eine ganze Zahl von Stunden: wahrscheinlich wurde die Ortszeit (Zonenzeit) als UTC angegeben; { $subtract ->
    [yes] ziehen Sie { $fix } h ab
   *[no] zählen Sie { $fix } h hinzu
  }, um sie zu berichtigen
blunder-half-hour-zone = der Unterschied beträgt { $hours } h, eine ganze Zahl halber Stunden: wahrscheinlich ist eine Zeitzone mit halber Stunde stehen geblieben; { $subtract ->
    [yes] ziehen Sie { $fix } h ab
   *[no] zählen Sie { $fix } h hinzu
  }, um sie zu berichtigen
blunder-contacts-exchanged = als Kontakt { $labelled } bezeichnet, passt aber an dieser Station zu Kontakt { $fits } (Unterschied { $oc } s): die Kontakte { $first } und { $second } wurden wahrscheinlich vertauscht
blunder-minute-typo = der Unterschied beträgt { $oc } s, bis auf { $miss } s { $n ->
    [one] { $n } ganze Minute
   *[other] { $n } ganze Minuten
  }: wahrscheinlich wurde eine Ziffer der Minuten falsch getippt; { $subtract ->
    [yes] ziehen Sie { $n } min ab
   *[no] zählen Sie { $n } min hinzu
  }, um sie zu berichtigen

## Ein Versatz, den alle Zeiten einer Station teilen

offset-cause-date = ein um { $n ->
    [one] { $n } Tag
   *[other] { $n } Tage
  } verschobenes Datum
offset-cause-zone = eine stehen gebliebene Zeitzone von { $hours } h
offset-cause-clock = eine um etwa { $seconds } s falsch gehende Uhr
all-your-timings = { $n ->
    [2] Ihre beiden Zeiten
   *[other] alle { $n } Ihrer Zeiten
  }
station-advice-date = { $all } liegen etwa { $days ->
    [one] { $days } Tag
   *[other] { $days } Tage
  } zu { $late ->
    [yes] spät
   *[no] früh
  }: das Datum ist wahrscheinlich falsch; prüfen Sie das geschriebene Datum und senden Sie sie erneut
station-advice-zone = { $all } liegen etwa { $hours } h zu { $late ->
    [yes] spät: die Zeitzone Ihrer Uhr ist wahrscheinlich stehen geblieben (Ortszeit als UTC angegeben); ziehen Sie von jeder Zeit { $hours } h ab
   *[no] früh: die Zeitzone Ihrer Uhr ist wahrscheinlich stehen geblieben (Ortszeit als UTC angegeben); zählen Sie zu jeder Zeit { $hours } h hinzu
  } und senden Sie sie erneut
station-advice-clock = { $all } liegen etwa { $seconds } s zu { $late ->
    [yes] spät: prüfen Sie die Uhr, mit der Sie gestoppt haben (stellen Sie sie nach einem Zeitzeichen oder GPS); ging sie so viel falsch, ziehen Sie von jeder Zeit { $seconds } s ab
   *[no] früh: prüfen Sie die Uhr, mit der Sie gestoppt haben (stellen Sie sie nach einem Zeitzeichen oder GPS); ging sie so viel falsch, zählen Sie zu jeder Zeit { $seconds } s hinzu
  } und senden Sie sie erneut

## Was zu tun ist

advice-check-date = prüfen Sie das Datum
advice-check-contact-and-place = prüfen Sie die Nummer des Kontakts und die Koordinaten Ihrer Station (südliche Breiten und westliche Längen sind negativ)
advice-check-place-and-date = prüfen Sie die Koordinaten Ihrer Station (westliche Längen sind negativ) und das Datum
advice-check-pair = prüfen Sie das Kontaktpaar und die Koordinaten Ihrer Station
advice-doubtful = prüfen Sie die Uhr, mit der Sie gestoppt haben, und die Nummer des Kontakts; stimmt die Zeit wie geschrieben, lassen Sie sie: die Lösung gewichtet sie mit den anderen
advice-slip = berichtigen Sie die Zeit wie gesagt und senden Sie sie über Ihren privaten Link unten erneut
advice-does-not-fit = prüfen Sie das Datum, die Zeitzone (geben Sie die Zeit in UTC an) und die Nummer des Kontakts
advice-see-station = siehe oben, was für die ganze Station zu ändern ist
advice-write-utc = schreiben Sie Datum und Uhrzeit in UTC, etwa { $example }
advice-correct-row = berichtigen Sie die Zeile und senden Sie sie erneut (Zeiten in UTC, etwa { $example })
