# transit-parallax : messages (results) en français. RELECTURE NÉCESSAIRE : elle demande la relecture d'un locuteur natif (translations want a native speaker's review).

## La page publique des résultats (/results)

results-title = Résultats : la parallaxe solaire à ce jour
results-not-determined = La parallaxe solaire et l'unité astronomique ne sont pas encore déterminées : { $why }.
results-no-timing-reduced = aucun chronométrage n'a encore été réduit
results-no-timings-arrived = aucun chronométrage n'est encore arrivé
results-first-being-computed = la première solution est en cours de calcul
results-parallax = parallaxe solaire
results-au = unité astronomique
results-timings-used = chronométrages utilisés
results-used-of = { $used } sur { $total }
results-au-value = { $au } ± { $sigma } millions de km (95 % : de { $lo } à { $hi } millions de km)
results-au-value-open = { $au } ± { $sigma } millions de km (95 % : à partir de { $lo } millions de km, sans borne supérieure)
results-au-not-given = non donnée : l'intervalle à un sigma de la parallaxe atteint zéro, les chronométrages ne lui fixent donc aucune borne supérieure
results-parallax-not-determined = La parallaxe solaire n'est pas encore déterminée, ni donc l'unité astronomique : { $why }.
results-default-why = les chronométrages en vigueur ne la déterminent pas
results-need-two-none = Il faut des chronométrages d'au moins deux stations éloignées l'une de l'autre ; aucune station n'en a encore envoyé d'utilisables.
results-need-two-one = Il faut des chronométrages d'au moins deux stations éloignées l'une de l'autre ; une seule station en a envoyé d'utilisables jusqu'ici.
results-counts = Stations : { $stations } ; chronométrages en vigueur : { $timings } ; envois : { $submissions }.
results-stations-heading = Les stations
results-map-caption = Les stations, chacune à sa place arrondie à 0,1 degré.
results-col-station = station
results-col-latitude = latitude (0,1°)
results-col-longitude = longitude (0,1°)
results-col-timings = chronométrages utilisés
results-col-share = part de l'information
results-share-not-determined = non déterminée
results-share-none = aucune
results-convergence-heading = Comment la solution a convergé
results-convergence-caption = La parallaxe solaire et son incertitude à mesure que les chronométrages s'ajoutent.
results-convergence-older = Tracé pour une version antérieure des données ({ $version }) ; la plus récente est en cours de tracé.
results-links = <a href="/register">Inscrire une station</a> · <a href="/">Envoyer vos chronométrages</a>

## La phrase « à jour au »

as-of-none = Aucune solution n'a encore été calculée
as-of-solution = Solution à jour au { $when } UTC (version { $version } des données)
as-of-settled = { $solution } ; elle comprend tous les chronométrages reçus.
as-of-pending = { $solution } ; { $n ->
    [one] 1 changement plus récent (un envoi, une correction ou une exclusion) est en cours de réduction.
   *[other] { $n } changements plus récents (envois, corrections ou exclusions) sont en cours de réduction.
  }

## Les graphiques de la page des résultats

chart-map-title = Carte du monde des stations
chart-map-not-used = { $station } (no { $number }) : non utilisée : { $why }
chart-map-station = { $station } (no { $number }) : part { $share }, z moyen { $z }
chart-map-colour-key = couleur : moyenne de (O - C)/σ
chart-map-area-key = aire : part de l'information
chart-convergence-title = Convergence de la parallaxe solaire
chart-convergence-too-few = Trop peu de chronométrages pour suivre la solution à mesure qu'ils s'ajoutent.
chart-convergence-timings-axis = chronométrages dans la solution (dans l'ordre du fichier)
chart-convergence-zoomed = Parallaxe solaire (secondes d'arc), agrandie autour de la valeur finale ± { $sigmas } incertitudes
chart-convergence-iau = valeur UAI 2009 { $value }"
chart-convergence-off-above = { $label } au-dessus, hors de cette échelle
chart-convergence-off-below = { $label } en dessous, hors de cette échelle
chart-convergence-sigma-axis = Son incertitude type (secondes d'arc, échelle logarithmique)
chart-convergence-point = { $timings } chronométrages : { $parallax }" ± { $sigma }"
chart-convergence-dashed = tirets : décroissance en 1/√N jusqu'à la valeur finale
