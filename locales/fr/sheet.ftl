# transit-parallax : messages (sheet) en français. RELECTURE NÉCESSAIRE : elle demande la relecture d'un locuteur natif (translations want a native speaker's review).
# La fiche de l'observateur (`predict --sheets`, la fiche d'une station inscrite auprès du service) et son calendrier.
# Les messages dont l'identifiant finit par -html sont du HTML, écrits tels quels (gardez leurs
# balises et entités). $planet vaut venus ou mercury ; $n est un nombre (il choisit la forme du
# pluriel) ; nombres et dates arrivent déjà écrits pour la langue ; les heures restent sur 24 h.

## L'en-tête

sheet-title =
    { $planet ->
        [venus] Transit de Vénus
       *[other] Transit de Mercure
    }, { $date } : { $station }
sheet-station-html = Station : <b>{ $station }</b>, latitude { $latitude }°, longitude { $longitude }° (positive vers l'est), altitude { $elevation } m.
sheet-zone-html = Les heures d'horloge sont en <b>{ $zone }</b> : { $abbreviation } (UTC{ $offset }) pendant le transit ; l'heure UTC est donnée à côté.
sheet-no-zone-html = Aucun fuseau horaire n'a été donné pour cette station, les heures sont donc <b>en UTC seulement</b>. Pour les avoir à l'heure de votre horloge, relancez <code>predict</code> avec <code>--time-zone FUSEAU</code> (par ex. <code>Europe/Paris</code> ou <code>+05:30</code>) ou ajoutez une colonne <code>time_zone</code> au fichier des stations.

## Les quatre contacts

sheet-contacts-heading = Les quatre contacts
sheet-col-contact = Contact
sheet-col-your-clock = Votre horloge
sheet-col-sun-altitude = Hauteur du Soleil
sheet-col-sun-azimuth = Azimut du Soleil
sheet-col-position-angle = Angle de position
sheet-col-vertex-angle = Angle au zénith
sheet-col-seen = Visible ?
sheet-no-such-contact = ce contact n'a pas lieu à cette station (transit rasant)
sheet-seen-yes = oui, Soleil levé
sheet-seen-no = non, sous l'horizon
sheet-contacts-note = Les heures sont arrondies à la seconde. Ce sont les contacts géométriques idéaux (I, II : entrée extérieure et intérieure ; III, IV : sortie intérieure et extérieure), prédits à ±{ $sigma } s d'après l'éphéméride, avec Delta T { $delta_t } s (voir le pied de page) ; ce que vous verrez peut différer de plusieurs secondes (la goutte noire, la turbulence, votre horloge). Hauteur : hauteur vraie du centre du Soleil (sans réfraction) ; azimut compté du nord vers l'est. Visible : le bord supérieur du Soleil au-dessus de l'horizon (hauteur vraie supérieure à −0°50′).

## Lever et coucher du Soleil

sheet-sun-heading = Lever et coucher du Soleil :
sheet-sun-up-throughout = Le Soleil reste levé pendant tout le transit.
sheet-sun-down-throughout = Le Soleil est couché pendant tout le transit : on n'en voit rien d'ici.
sheet-sun-rises-html = Le Soleil se lève pendant le transit, à { $time }.
sheet-sun-sets-html = Le Soleil se couche pendant le transit, à { $time }.
sheet-sun-note = (bord supérieur à l'horizon, hauteur standard −0°50′, Meeus chap. 15 ; l'altitude de la station n'est pas prise en compte)

## Où regarder sur le bord du Soleil

sheet-drawings-heading = Où regarder sur le bord du Soleil
sheet-zenith-caption-1 = Dans le ciel : zénith en haut
sheet-zenith-caption-2 = (angle au zénith)
sheet-north-caption-1 = Monture équatoriale :
sheet-north-caption-2 = N en haut, E à gauche (angle de position)
sheet-drawings-note = L'angle de position est compté depuis le point nord du disque vers l'est, l'angle au zénith depuis le point le plus proche du zénith vers l'est ; tous deux dans le sens inverse des aiguilles d'une montre ici, comme on voit le ciel directement. Un renvoi coudé inverse l'image et un écran de projection peut l'inverser ou la tourner : vérifiez dans quel sens le Soleil dérive avant le transit.
limb-zenith-label = Disque solaire tel qu'on le voit dans le ciel, zénith en haut
limb-north-label = Disque solaire nord en haut, est à gauche
limb-zenith = Zénith
limb-north = N
limb-east = E

## Le tableau vierge pour les instants

sheet-timings-heading = Vos instants
sheet-col-clock-time = Heure de l'horloge (hh:mm:ss.s)
sheet-col-zone = Fuseau ou décalage
sheet-col-sure-html = Sûr à&nbsp;±&nbsp;s
sheet-col-observer = Observateur
sheet-col-what-seen = Ce que vous avez vu (goutte noire, nuages)
sheet-fill-observers = Observateur(s) :
sheet-fill-instrument = Instrument, ouverture (mm), filtre ou projection :
sheet-fill-clock = Horloge réglée par (GPS, radio, téléphone), son erreur :
sheet-reduce-note-html = Pour <code>reduce</code>, recopiez chaque ligne dans un fichier d'observations (<code>transit-parallax template observations</code>) : contact, time_utc (ou l'heure de l'horloge avec son décalage, 2032-11-13T07:43:40.5+01:00), sigma_s (votre certitude) et observer.

## Le pied de page

sheet-calendar-empty = Aucun des contacts n'est vu d'ici avec le Soleil levé, le calendrier { $file } ne contient donc aucun événement.
sheet-calendar-holds =
    Le calendrier { $file } contient { $n ->
        [one] le contact vu
       *[other] les { $n } contacts vus
    } avec le Soleil levé, avec des rappels.
sheet-computed = Calculé par transit-parallax { $version } avec l'éphéméride { $ephemeris } ; Delta T { $delta_t } s.

## Delta T

sheet-delta-t-fixed-value = { $value }, fixé
sheet-delta-t-fixed = Delta T fixé par --delta-t.
sheet-delta-t-from = Delta T d'après { $source }.
sheet-delta-t-source-leap-seconds = la table des secondes intercalaires et le DUT1 donné
sheet-delta-t-source-reconstruction = la reconstruction de Morrison, Stephenson, Hohenkerk et Zawilski (2021)
sheet-delta-t-source-observed = les observations de l'IERS
sheet-delta-t-source-predicted = les prédictions du Bulletin A de l'IERS
sheet-delta-t-source-extrapolated = une extrapolation : le milieu de trois prédictions publiées, la moitié de leur écart comme incertitude
sheet-times-utc-hardly = Les heures sont en UTC ; l'incertitude de Delta T ne déplace guère les contacts.
sheet-times-ut1 = Les heures sont en UT1, soit TT - Delta T : une erreur sur Delta T déplace chaque heure imprimée d'à peu près autant.
sheet-times-utc = Les heures sont en UTC.
sheet-times-utc-held = Les heures sont en UTC, TAI - UTC étant maintenu à sa dernière valeur, de sorte qu'elles restent liées à TT : une erreur sur Delta T ne les déplace que par la rotation de la Terre sous l'événement (des secondes pour des minutes de Delta T), tandis que l'UT1 de chaque contact, et toute seconde intercalaire encore à venir, se déplacerait de toute l'erreur.

## Le calendrier (.ics)

calendar-summary =
    { $planet ->
        [venus] Transit de Vénus
       *[other] Transit de Mercure
    } : contact { $contact } ({ $station })
calendar-clock-time = Heure de l'horloge { $time } ({ $abbreviation }).
calendar-description =
    Contact { $contact } du transit de { $planet ->
        [venus] Vénus
       *[other] Mercure
    } à { $station } : { $clock }UTC { $utc }. Hauteur du Soleil { $altitude } degrés, angle de position { $position_angle }, angle au zénith { $vertex_angle }.
calendar-reminder =
    Contact { $contact } du transit de { $planet ->
        [venus] Vénus
       *[other] Mercure
    } dans { $n } minutes
