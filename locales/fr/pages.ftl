# transit-parallax : les pages des participants en français.
# RELECTURE NÉCESSAIRE : traduction faite par les développeurs du projet ; elle demande la
# relecture d'un locuteur natif (translations want a native speaker's review).
# Variables : $n est un nombre (il choisit la forme du pluriel) ; les autres valeurs arrivent
# en texte, les nombres déjà écrits pour la langue.

## Le cadre de chaque page

skip-link = Aller au contenu
site-line = chronométrages mis en commun
solar-caution = ATTENTION : regarder le Soleil peut rendre aveugle. Ne regardez jamais le Soleil, même un instant ou en partie caché, sans un filtre solaire certifié à l'avant de l'instrument ou devant l'œil, ou regardez son image projetée sur un écran. Ne regardez jamais à travers un chercheur optique : bouchez-le ou retirez-le. Suivez les consignes locales, les règles de votre site et les directives d'un encadrant expérimenté.
footer-line = transit-parallax { $version } : chronométrages de contacts mis en commun pour la parallaxe solaire. Ces pages ne chargent rien d'ailleurs et n'exécutent aucun script.
language-switch = Langue
back-to-form = Retour au formulaire

## Le formulaire du participant

form-title = Envoyez vos chronométrages
form-intro = Envoyez les instants de contact que vous avez observés lors du transit de { $planet ->
        [venus] Vénus
       *[other] Mercure
    } du { $date }. Vous verrez aussitôt comment chacun se compare à sa prédiction pour votre station.
form-before-and-after = Avant l'événement, <a href="/register">inscrivez votre station</a> pour recevoir sa fiche d'observation et son calendrier ; <a href="/results">les résultats obtenus jusqu'ici</a> sont publics.
station-heading = Votre station
station-name = Nom de la station
station-name-hint = tel que vous voulez le voir affiché
latitude = Latitude (degrés)
latitude-hint = nord positive, sud négative : { $example }
longitude = Longitude (degrés)
longitude-hint = est positive, ouest négative : { $example }
elevation = Altitude (mètres)
elevation-hint = au-dessus du niveau de la mer
longitude-sigma = Incertitude de la longitude (degrés)
longitude-sigma-hint = ou le mot unknown ; laissez vide si la longitude est exacte
timings-heading = Vos chronométrages
timings-note = Un bloc par contact chronométré ; laissez les autres sur « non chronométré ».
timing-legend = Chronométrage { $number }
contact = Contact
contact-none = non chronométré
contact-1 = I : entrée extérieure (premier contact)
contact-2 = II : entrée intérieure (entièrement sur le Soleil)
contact-3 = III : sortie intérieure (commence à sortir)
contact-4 = IV : sortie extérieure (dernier contact)
time-utc = Heure (UTC)
time-utc-hint = date et heure avec Z : { $example }
sigma = Incertitude (secondes)
sigma-hint = votre degré de certitude sur l'heure ; vide : l'habituelle pour ce contact
local-summary = Chronométré en temps solaire local (un ancien relevé) ?
time-local = Temps solaire local
time-local-hint = au lieu de l'UTC, sans fuseau : { $example }
local-kind = Type de temps local
local-kind-none = aucun (l'heure est en UTC)
local-kind-apparent = vrai (heure du cadran solaire)
local-kind-mean = moyen (temps moyen local)
day-reckoning = Décompte du jour
day-civil = civil (depuis minuit)
day-astronomical = astronomique (depuis midi)
as-sent = tel qu'envoyé : { $value }
send-timings = Envoyer ces chronométrages
paste-legend = Ou collez un fichier d'observations
paste-label = Observations (CSV)
paste-hint = avec les colonnes { $columns }
send-paste = Envoyer le fichier collé
upload-legend = Ou envoyez un fichier d'observations
upload-label = Fichier
upload-hint = CSV avec les colonnes ci-dessus, ou un tableur .xlsx ou .ods
send-file = Envoyer le fichier
limits = Limites : un fichier collé ou envoyé peut faire jusqu'à { $kb } Ko (environ { $rows } lignes) ; découpez un fichier plus long en parties et envoyez chacune. Chaque partie est un envoi à part ; les chronométrages d'une même station répartis en plusieurs parties sont mis en commun.

## La réponse après un envoi

feedback-title = Merci : vos chronométrages
feedback-title-unread = Vos chronométrages n'ont pas pu être lus
feedback-duplicate = C'est le même qu'un envoi déjà reçu ; il n'a pas été compté deux fois.
feedback-received = Reçu et enregistré comme envoi { $id } : { $n ->
    [one] { $n } chronométrage lu.
   *[other] { $n } chronométrages lus.
  }
feedback-some-unread = { $n ->
    [one] { $n } ligne n'a pas pu être lue : voir ci-dessous.
   *[other] { $n } lignes n'ont pas pu être lues : voir ci-dessous.
  }
feedback-none-read = Nous avons gardé ce que vous avez envoyé (envoi { $id }) pour que l'organisateur puisse le voir, mais aucune de ses { $n ->
    [one] { $n } ligne
   *[other] { $n } lignes
  } n'a pu être lue comme un chronométrage. Ci-dessous, sous chaque ligne : ce qui n'a pas pu être lu et ce qu'il faut changer. Puis renvoyez les chronométrages.
feedback-private-link = Pour revoir ou corriger votre envoi plus tard, gardez ce lien privé :
feedback-versions = Une correction est enregistrée comme nouvelle version ; l'ancienne est conservée.
send-another = Envoyer un autre
all-together = Tous vos chronométrages ensemble : { $station }
each-timing = Chaque chronométrage
card-contact = Contact { $contact }
card-contact-none = (non indiqué)
card-station = Station
card-your-time = Votre heure
card-predicted = Prédite
card-difference = Écart
card-sun-altitude = Hauteur du Soleil
card-sun-altitude-value = { $degrees } degrés
card-verdict = Verdict
card-meaning = Ce que cela signifie
card-what-to-do = Que faire
card-nothing-to-do = rien : merci
verdict-fits = concorde
verdict-doubtful = douteux
verdict-does-not-fit = ne concorde pas
verdict-unread = illisible
later-than-predicted = { $size } plus tard que prévu
earlier-than-predicted = { $size } plus tôt que prévu
share-later = Votre part de l'information de la campagne sur la parallaxe solaire s'affichera quand au moins { $min } stations auront envoyé des chronométrages ({ $so_far } jusqu'ici) : la parallaxe se mesure en comparant les stations.
share-none = Ces chronométrages n'apportent pas encore d'information sur la parallaxe (aucun n'a pu être utilisé).
share-value = Part attendue de votre station dans l'information de la campagne sur la parallaxe solaire jusqu'ici : { $percent } % (avant l'ajustement de la position de la planète et des rayons).

## La relecture de son propre envoi, et les refus

review-title = Votre envoi { $id }
review-correct-heading = Le corriger
review-correct-note = Envoyer ce formulaire enregistre une nouvelle version ; l'ancienne est conservée.
review-superseded = Cette version a été corrigée par une plus récente.
not-found = Introuvable
not-found-submission = Aucun envoi ne correspond à ce lien.
refused = Refusé
refused-not-in-force = Ce lien n'ouvre pas un envoi en vigueur.
not-received = Non reçu
choose-a-file = Choisissez un fichier à envoyer.
not-read = Non lu
stored-as-it-came = Ce que vous avez envoyé a été enregistré tel quel, et l'organisateur peut le voir.
verdict-slip = probablement une erreur que vous pouvez corriger

## Comment les chronométrages ont été faits

how-heading = Comment vous avez chronométré
observer = Observateur
observer-hint = votre nom ou celui de votre groupe ; facultatif
clock-source = Horloge sur laquelle vous avez lu l'heure
instrument = Instrument
instrument-hint = p. ex. lunette de 80 mm
aperture = Ouverture (millimètres)
aperture-hint = le diamètre de l'objectif ou du miroir
viewing = Comment vous avez regardé le Soleil
notes = Remarques
notes-hint = turbulence, nuages, tout ce que l'organisateur devrait savoir
not-said = non précisé
clock-gps = récepteur GPS
clock-radio = signal horaire radio
clock-network = ordinateur à l'heure du réseau
clock-phone = téléphone portable
clock-other = autre (une montre réglée à la main)
viewing-filter = filtre solaire certifié à l'avant
viewing-projection = projection sur un écran

## Inscrire une station avant l'événement

register-title = Inscrivez votre station
register-intro = Inscrivez votre station avant le transit : vous recevez aussitôt un lien privé vers votre fiche d'observation (les contacts à l'heure de votre propre horloge, un tableau vierge pour les chronométrages) et un calendrier des contacts pour votre téléphone. Après l'événement, envoyez vos chronométrages sous le même nom de station, et l'organisateur verra que votre station a répondu.
register-refused = Non inscrite :
register-name-hint = tel que vous voulez le voir affiché ; envoyez vos chronométrages sous le même nom
register-elevation-hint = au-dessus du niveau de la mer ; vide : 0
register-zone = Fuseau horaire de vos horloges
register-zone-hint = un nom comme Europe/Paris, America/Montreal ou Africa/Dakar, ou un décalage comme +01:00
register-button = Inscrire la station
register-privacy = Le nom de votre station et sa position arrondie au dixième de degré peuvent paraître sur la page publique des résultats ; le lien privé n'appartient qu'à vous.

## La page privée d'une station inscrite

registered-title = Inscrite : { $station }
registered-private-link-html = Votre lien privé : <a id="private" href="{ $href }">{ $href }</a>. Gardez-le : il rouvre votre fiche et votre calendrier, et quiconque l'a le peut aussi.
registered-sheet-html = <a id="sheet" href="{ $href }">Votre fiche d'observation</a> : une page à imprimer avec les contacts à l'heure de votre horloge et un tableau pour vos chronométrages.
registered-calendar-html = <a id="calendar" href="{ $href }" download="{ $file }">Votre calendrier des contacts</a> (.ics, avec rappels) pour un téléphone ou un agenda.
registered-station-heading = Votre station
registered-station = { $station } : latitude { $latitude }°, longitude { $longitude }°, altitude { $elevation } m ; horloges en { $zone }.
registered-contacts-heading = Les contacts là-bas
registered-contact = Contact { $contact } : { $clock } ({ $utc } UTC), { $sun }
registered-sun-up = le Soleil à { $degrees }° de hauteur
registered-sun-down = le Soleil sous l'horizon : invisible
registered-no-contact = Aucun contact de ce transit n'a lieu à cet endroit.
registered-after-html = Après l'événement, <a href="/">envoyez vos chronométrages</a> sous le même nom de station.
not-found-registration = Aucune inscription ne correspond à ce lien.
