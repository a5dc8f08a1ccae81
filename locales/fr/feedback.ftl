# transit-parallax : messages (feedback) en français. RELECTURE NÉCESSAIRE : elle demande la relecture d'un locuteur natif (translations want a native speaker's review).

## L'écart d'un intervalle chronométré à sa prédiction

later-than-predicted-interval = { $size } de plus que l'intervalle prévu
earlier-than-predicted-interval = { $size } de moins que l'intervalle prévu

## Ce que signifie l'écart d'un chronométrage

feedback-fits = { $diff } : dans ce que permet l'incertitude de votre chronométrage
feedback-probably = { $diff } : probablement { $blunder }
feedback-more-than-stated = { $diff } : plus que ne le permet l'incertitude que vous avez indiquée ({ $sigma } s)
feedback-far-off = { $diff } : bien plus que toute erreur de la prédiction ou d'une horloge
feedback-outside-years = l'instant est hors des années que couvre l'outil
feedback-contact-not-seen = votre station ne voit pas le contact { $contact } de ce transit (la trajectoire de la planète vue de chez vous n'atteint pas ce cercle)
feedback-interval-not-seen = votre station ne voit pas l'intervalle { $interval } de ce transit
feedback-sun-down = le Soleil était à { $degrees } degrés sous l'horizon à votre station lors de ce contact
feedback-part-of-offset = { $diff } : une partie du décalage que partagent tous vos chronométrages, probablement { $cause } (dit une fois, plus haut) ; sans lui, ce chronométrage est à { $rest } s de sa prédiction
feedback-submission-unread = l'envoi n'a pas pu être lu comme des chronométrages
feedback-row-unread = la ligne ne peut pas être lue
unread-time-quoted = l'heure « { $time } » n'a pas pu être lue comme une date et une heure
unread-time = une heure n'a pas pu être lue comme une date et une heure

## Les erreurs d'un chronométrage (ce que trouve la réduction elle-même)

blunder-date-off = le chronométrage est à { $oc } s de sa prédiction, à un jour près à { $miss } s : la date est probablement décalée d'un jour ({ $late ->
    [yes] un jour en retard
   *[no] un jour en avance
  })
blunder-half-day = l'écart est de { $hours } h, une demi-journée : les comptes civil et astronomique du jour ont probablement été confondus (un jour astronomique commence à midi : le 3 juin astronomique à 21 h est le 4 juin civil à 9 h ; mettez day_reckoning à { $late ->
    [yes] civil si les lignes disent astronomique
   *[no] astronomical si les lignes disent civil
  }), ou le matin et l'après-midi sur une horloge moderne
blunder-zone-hours = l'écart est de { $hours } h, un nombre entier d'heures : l'heure locale (du fuseau) a probablement été donnée comme UTC ; { $subtract ->
    [yes] retranchez
   *[no] ajoutez
  } { $fix } h pour la corriger
blunder-half-hour-zone = l'écart est de { $hours } h, un nombre entier de demi-heures : un fuseau horaire à la demi-heure est probablement resté ; { $subtract ->
    [yes] retranchez
   *[no] ajoutez
  } { $fix } h pour la corriger
blunder-contacts-exchanged = noté contact { $labelled } mais correspond au contact { $fits } à cette station (écart { $oc } s) : les contacts { $first } et { $second } ont probablement été intervertis
blunder-minute-typo = l'écart est de { $oc } s, { $n ->
    [one] { $n } minute entière
   *[other] { $n } minutes entières
  } à { $miss } s près : un chiffre des minutes a probablement été mal tapé ; { $subtract ->
    [yes] retranchez
   *[no] ajoutez
  } { $n } min pour la corriger

## Un décalage que partagent tous les chronométrages d'une station

offset-cause-date = une date décalée { $n ->
    [one] d'{ $n } jour
   *[other] de { $n } jours
  }
offset-cause-zone = un fuseau horaire de { $hours } h resté dans l'heure
offset-cause-clock = une horloge décalée d'environ { $seconds } s
all-your-timings = { $n ->
    [2] vos deux chronométrages
   *[other] vos { $n } chronométrages
  }
station-advice-date = { $all } sont décalés d'environ { $days ->
    [one] { $days } jour
   *[other] { $days } jours
  } { $late ->
    [yes] en retard
   *[no] en avance
  } : la date est probablement fausse ; vérifiez la date que vous avez écrite et renvoyez-les
station-advice-zone = { $all } sont décalés d'environ { $hours } h { $late ->
    [yes] en retard : le fuseau horaire de votre horloge est probablement resté (heure locale donnée comme UTC) ; retranchez { $hours } h
   *[no] en avance : le fuseau horaire de votre horloge est probablement resté (heure locale donnée comme UTC) ; ajoutez { $hours } h
  } à chacun et renvoyez-les
station-advice-clock = { $all } sont décalés d'environ { $seconds } s { $late ->
    [yes] en retard : vérifiez l'horloge avec laquelle vous avez chronométré (réglez-la sur un signal horaire ou le GPS) ; si elle était décalée d'autant, retranchez { $seconds } s
   *[no] en avance : vérifiez l'horloge avec laquelle vous avez chronométré (réglez-la sur un signal horaire ou le GPS) ; si elle était décalée d'autant, ajoutez { $seconds } s
  } à chacun et renvoyez-les

## Que faire

advice-check-date = vérifiez la date
advice-check-contact-and-place = vérifiez le numéro du contact et les coordonnées de votre station (les latitudes sud et les longitudes ouest sont négatives)
advice-check-place-and-date = vérifiez les coordonnées de votre station (les longitudes ouest sont négatives) et la date
advice-check-pair = vérifiez la paire de contacts et les coordonnées de votre station
advice-doubtful = vérifiez l'horloge avec laquelle vous avez chronométré et le numéro du contact ; si l'heure est juste telle qu'écrite, laissez-la : la solution la pondère avec les autres
advice-slip = corrigez l'heure comme indiqué, puis renvoyez-la par votre lien privé ci-dessous
advice-does-not-fit = vérifiez la date, le fuseau horaire (donnez l'heure en UTC) et le numéro du contact
advice-see-station = voyez plus haut ce qu'il faut changer pour toute la station
advice-write-utc = écrivez la date et l'heure du jour en UTC, comme { $example }
advice-correct-row = corrigez la ligne et renvoyez-la (heures en UTC, comme { $example })
