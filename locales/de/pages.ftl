# transit-parallax: die Seiten der Teilnehmenden auf Deutsch.
# DURCHSICHT NÖTIG: Übersetzung der Entwickler des Projekts; sie braucht die Durchsicht einer
# Muttersprachlerin oder eines Muttersprachlers (translations want a native speaker's review).
# Variablen: $n ist eine Anzahl (sie wählt die Pluralform); alle anderen Werte kommen als
# Text, Zahlen schon für die Sprache geschrieben.

## Der Rahmen jeder Seite

skip-link = Zum Inhalt springen
site-line = gemeinsame Zeitmessungen
solar-caution = VORSICHT: Ein Blick in die Sonne kann blind machen. Schauen Sie nie in die Sonne, auch nicht kurz oder wenn sie teilweise bedeckt ist, ohne einen zertifizierten Sonnenfilter vorn am Fernrohr oder vor dem Auge, oder betrachten Sie ihr Bild auf einem Projektionsschirm. Schauen Sie nie durch einen optischen Sucher: Decken Sie ihn ab oder nehmen Sie ihn ab. Folgen Sie den örtlichen Hinweisen, den Regeln Ihres Standorts und den Anweisungen einer erfahrenen Aufsicht.
footer-line = transit-parallax { $version }: Kontaktzeiten, gemeinsam ausgewertet für die Sonnenparallaxe. Diese Seiten laden nichts von anderswo und führen kein Skript aus.
language-switch = Sprache
back-to-form = Zurück zum Formular

## Das Formular der Teilnehmenden

form-title = Senden Sie Ihre Zeiten
form-intro = Senden Sie die Kontaktzeiten, die Sie beim Transit von { $planet ->
        [venus] Venus
       *[other] Merkur
    } am { $date } beobachtet haben. Sie sehen sofort, wie jede mit ihrer Vorhersage für Ihre Station übereinstimmt.
form-before-and-after = Melden Sie vor dem Ereignis <a href="/register">Ihre Station an</a>, um ihr Beobachtungsblatt und ihren Kalender zu erhalten; <a href="/results">die bisherigen Ergebnisse</a> sind öffentlich.
station-heading = Ihre Station
station-name = Name der Station
station-name-hint = so, wie er angezeigt werden soll
latitude = Breite (Grad)
latitude-hint = Nord positiv, Süd negativ: { $example }
longitude = Länge (Grad)
longitude-hint = Ost positiv, West negativ: { $example }
elevation = Höhe (Meter)
elevation-hint = über dem Meeresspiegel
longitude-sigma = Unsicherheit der Länge (Grad)
longitude-sigma-hint = oder das Wort unknown; leer lassen, wenn die Länge genau ist
timings-heading = Ihre Zeiten
timings-note = Ein Block je gemessenem Kontakt; lassen Sie die anderen auf „nicht gemessen“.
timing-legend = Zeit { $number }
contact = Kontakt
contact-none = nicht gemessen
contact-1 = I: äußerer Eintritt (erste Berührung)
contact-2 = II: innerer Eintritt (ganz auf der Sonne)
contact-3 = III: innerer Austritt (beginnt zu verlassen)
contact-4 = IV: äußerer Austritt (letzte Berührung)
time-utc = Zeit (UTC)
time-utc-hint = Datum und Uhrzeit mit Z: { $example }
sigma = Unsicherheit (Sekunden)
sigma-hint = wie sicher Sie sich der Zeit sind; leer: die übliche für diesen Kontakt
local-summary = In örtlicher Sonnenzeit gemessen (eine alte Aufzeichnung)?
time-local = Örtliche Sonnenzeit
time-local-hint = statt UTC, ohne Zone: { $example }
local-kind = Art der Ortszeit
local-kind-none = keine (die Zeit ist UTC)
local-kind-apparent = wahre (Sonnenuhrzeit)
local-kind-mean = mittlere (mittlere Ortszeit)
day-reckoning = Tageszählung
day-civil = bürgerlich (ab Mitternacht)
day-astronomical = astronomisch (ab Mittag)
as-sent = wie gesendet: { $value }
send-timings = Diese Zeiten senden
paste-legend = Oder fügen Sie eine Beobachtungsdatei ein
paste-label = Beobachtungen (CSV)
paste-hint = mit den Spalten { $columns }
send-paste = Die eingefügte Datei senden
upload-legend = Oder senden Sie eine Beobachtungsdatei
upload-label = Datei
upload-hint = CSV mit den Spalten oben, oder eine Tabelle .xlsx oder .ods
send-file = Die Datei senden
limits = Grenzen: Eine eingefügte oder gesendete Datei darf bis zu { $kb } KB groß sein (etwa { $rows } Zeilen); teilen Sie eine längere Datei in Teile und senden Sie jeden. Jeder Teil ist eine eigene Einsendung; die Zeiten einer Station aus mehreren Teilen werden zusammengeführt.

## Die Antwort nach einer Einsendung

feedback-title = Danke: Ihre Zeiten
feedback-title-unread = Ihre Zeiten konnten nicht gelesen werden
feedback-duplicate = Dies gleicht einer schon erhaltenen Einsendung; sie wurde nicht doppelt gezählt.
feedback-received = Erhalten und gespeichert als Einsendung { $id }: { $n ->
    [one] { $n } Zeit gelesen.
   *[other] { $n } Zeiten gelesen.
  }
feedback-some-unread = { $n ->
    [one] { $n } Zeile konnte nicht gelesen werden: siehe unten.
   *[other] { $n } Zeilen konnten nicht gelesen werden: siehe unten.
  }
feedback-none-read = Wir haben Ihre Sendung (als Einsendung { $id }) aufbewahrt, damit die Organisation sie sehen kann, aber keine ihrer { $n ->
    [one] { $n } Zeile
   *[other] { $n } Zeilen
  } ließ sich als Zeit lesen. Unten, unter jeder Zeile: was nicht gelesen werden konnte und was zu ändern ist. Senden Sie die Zeiten dann erneut.
feedback-private-link = Um Ihre Einsendung später anzusehen oder zu berichtigen, bewahren Sie diesen privaten Link auf:
feedback-versions = Eine Berichtigung wird als neue Fassung gespeichert; die alte bleibt erhalten.
send-another = Weitere senden
all-together = Alle Ihre Zeiten zusammen: { $station }
each-timing = Jede Zeit
card-contact = Kontakt { $contact }
card-contact-none = (nicht angegeben)
card-station = Station
card-your-time = Ihre Zeit
card-predicted = Vorhergesagt
card-difference = Unterschied
card-sun-altitude = Höhe der Sonne
card-sun-altitude-value = { $degrees } Grad
card-verdict = Urteil
card-meaning = Was es bedeutet
card-what-to-do = Was zu tun ist
card-nothing-to-do = nichts: danke
verdict-fits = passt
verdict-doubtful = zweifelhaft
verdict-does-not-fit = passt nicht
verdict-unread = nicht lesbar
later-than-predicted = { $size } später als vorhergesagt
earlier-than-predicted = { $size } früher als vorhergesagt
share-later = Ihr Anteil an der Information der Kampagne über die Sonnenparallaxe wird angezeigt, sobald mindestens { $min } Stationen Zeiten gesendet haben (bisher { $so_far }): Die Parallaxe wird durch den Vergleich von Stationen gemessen.
share-none = Diese Zeiten tragen noch keine Information über die Parallaxe (keine konnte verwendet werden).
share-value = Erwarteter Anteil Ihrer Station an der Information der Kampagne über die Sonnenparallaxe bisher: { $percent } % (bevor der Ort des Planeten und die Radien angepasst werden).

## Die Durchsicht der eigenen Einsendung, und Ablehnungen

review-title = Ihre Einsendung { $id }
review-correct-heading = Berichtigen
review-correct-note = Das Senden dieses Formulars speichert eine neue Fassung; die alte bleibt erhalten.
review-superseded = Diese Fassung wurde durch eine spätere berichtigt.
not-found = Nicht gefunden
not-found-submission = Zu diesem Link gehört keine Einsendung.
refused = Abgelehnt
refused-not-in-force = Dieser Link öffnet keine gültige Einsendung.
not-received = Nicht erhalten
choose-a-file = Wählen Sie eine Datei zum Senden.
not-read = Nicht gelesen
stored-as-it-came = Ihre Sendung wurde so gespeichert, wie sie ankam, und die Organisation kann sie sehen.
verdict-slip = wahrscheinlich ein Versehen, das Sie berichtigen können

## Wie die Zeiten gemessen wurden

how-heading = Wie Sie gemessen haben
observer = Beobachter
observer-hint = Ihr Name oder der Ihrer Gruppe; freiwillig
clock-source = Uhr, von der Sie die Zeit abgelesen haben
instrument = Instrument
instrument-hint = z. B. 80-mm-Refraktor
aperture = Öffnung (Millimeter)
aperture-hint = der Durchmesser von Linse oder Spiegel
viewing = Wie Sie die Sonne betrachtet haben
notes = Bemerkungen
notes-hint = Luftunruhe, Wolken, alles, was die Organisation wissen sollte
not-said = nicht angegeben
clock-gps = GPS-Empfänger
clock-radio = Funkzeitsignal
clock-network = Computer mit Netzwerkzeit
clock-phone = Mobiltelefon
clock-other = andere (eine von Hand gestellte Uhr)
viewing-filter = zertifizierter Sonnenfilter vorn
viewing-projection = Projektion auf einen Schirm

## Eine Station vor dem Ereignis anmelden

register-title = Melden Sie Ihre Station an
register-intro = Melden Sie Ihre Station vor dem Transit an: Sie erhalten sofort einen privaten Link zu Ihrem Beobachtungsblatt (die Kontakte in der Zeit Ihrer eigenen Uhr, eine leere Tabelle für die Zeiten) und einen Kalender der Kontakte für Ihr Telefon. Senden Sie nach dem Ereignis Ihre Zeiten unter demselben Stationsnamen, und die Organisation sieht, dass Ihre Station gemeldet hat.
register-refused = Nicht angemeldet:
register-name-hint = so, wie er angezeigt werden soll; senden Sie Ihre Zeiten unter demselben Namen
register-elevation-hint = über dem Meeresspiegel; leer: 0
register-zone = Zeitzone Ihrer Uhren
register-zone-hint = ein Name wie Europe/Berlin, Europe/Vienna oder Europe/Zurich, oder ein Versatz wie +01:00
register-button = Die Station anmelden
register-privacy = Der Name Ihrer Station und ihr auf ein Zehntelgrad gerundeter Ort können auf der öffentlichen Ergebnisseite erscheinen; der private Link gehört nur Ihnen.

## Die private Seite einer angemeldeten Station

registered-title = Angemeldet: { $station }
registered-private-link-html = Ihr privater Link: <a id="private" href="{ $href }">{ $href }</a>. Bewahren Sie ihn auf: Er öffnet Ihr Blatt und Ihren Kalender wieder, und jeder, der ihn hat, kann das auch.
registered-sheet-html = <a id="sheet" href="{ $href }">Ihr Beobachtungsblatt</a>: eine Seite zum Ausdrucken mit den Kontakten in der Zeit Ihrer Uhr und einer Tabelle für Ihre Zeiten.
registered-calendar-html = <a id="calendar" href="{ $href }" download="{ $file }">Ihr Kalender der Kontakte</a> (.ics, mit Erinnerungen) für ein Telefon oder ein Kalenderprogramm.
registered-station-heading = Ihre Station
registered-station = { $station }: Breite { $latitude }°, Länge { $longitude }°, Höhe { $elevation } m; Uhren auf { $zone }.
registered-contacts-heading = Die Kontakte dort
registered-contact = Kontakt { $contact }: { $clock } ({ $utc } UTC), { $sun }
registered-sun-up = die Sonne { $degrees }° hoch
registered-sun-down = die Sonne unter dem Horizont: nicht sichtbar
registered-no-contact = An diesem Ort findet kein Kontakt dieses Transits statt.
registered-after-html = Senden Sie nach dem Ereignis <a href="/">Ihre Zeiten</a> unter demselben Stationsnamen.
not-found-registration = Zu diesem Link gehört keine Anmeldung.
