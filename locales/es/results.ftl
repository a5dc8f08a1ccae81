# transit-parallax: mensajes (results) en español. REVISIÓN PENDIENTE: necesita la revisión de un hablante nativo (translations want a native speaker's review).

## La página pública de resultados (/results)

results-title = Resultados: la paralaje solar hasta ahora
results-not-determined = La paralaje solar y la unidad astronómica aún no están determinadas: { $why }.
results-no-timing-reduced = todavía no se ha reducido ningún tiempo
results-no-timings-arrived = todavía no ha llegado ningún tiempo
results-first-being-computed = se está calculando la primera solución
results-parallax = paralaje solar
results-au = unidad astronómica
results-timings-used = tiempos usados
results-used-of = { $used } de { $total }
results-au-value = { $au } ± { $sigma } millones de km (95 %: de { $lo } a { $hi } millones de km)
results-au-value-open = { $au } ± { $sigma } millones de km (95 %: desde { $lo } millones de km, sin límite superior)
results-au-not-given = no se da: el intervalo de una sigma de la paralaje llega a cero, así que los tiempos no le ponen cota superior
results-parallax-not-determined = La paralaje solar aún no está determinada, ni por tanto la unidad astronómica: { $why }.
results-default-why = los tiempos vigentes no la determinan
results-need-two-none = Hacen falta tiempos de al menos dos estaciones muy alejadas; ninguna estación ha enviado todavía tiempos utilizables.
results-need-two-one = Hacen falta tiempos de al menos dos estaciones muy alejadas; hasta ahora solo una estación ha enviado tiempos utilizables.
results-counts = Estaciones: { $stations }; tiempos vigentes: { $timings }; envíos: { $submissions }.
results-stations-heading = Las estaciones
results-map-caption = Las estaciones, cada una en su lugar redondeado a 0,1 grados.
results-col-station = estación
results-col-latitude = latitud (0,1°)
results-col-longitude = longitud (0,1°)
results-col-timings = tiempos usados
results-col-share = parte de la información
results-share-not-determined = no determinada
results-share-none = ninguna
results-convergence-heading = Cómo convergió la solución
results-convergence-caption = La paralaje solar y su incertidumbre a medida que se añaden los tiempos.
results-convergence-older = Dibujado para una versión anterior de los datos ({ $version }); se está dibujando la más reciente.
results-links = <a href="/register">Inscribir una estación</a> · <a href="/">Enviar sus tiempos</a>

## La frase «a fecha de»

as-of-none = Todavía no se ha calculado ninguna solución
as-of-solution = Solución a las { $when } UTC (versión { $version } de los datos)
as-of-settled = { $solution }; incluye todos los tiempos recibidos.
as-of-pending = { $solution }; { $n ->
    [one] se está reduciendo 1 cambio más reciente (un envío, una corrección o una exclusión).
   *[other] se están reduciendo { $n } cambios más recientes (envíos, correcciones o exclusiones).
  }

## Los gráficos de la página de resultados

chart-map-title = Mapa mundial de las estaciones
chart-map-not-used = { $station } (n.º { $number }): no usada: { $why }
chart-map-station = { $station } (n.º { $number }): parte { $share }, z media { $z }
chart-map-colour-key = color: media de (O - C)/σ
chart-map-area-key = área: parte de la información
chart-convergence-title = Convergencia de la paralaje solar
chart-convergence-too-few = Demasiado pocos tiempos para seguir la solución a medida que se añaden.
chart-convergence-timings-axis = tiempos en la solución (en el orden del archivo)
chart-convergence-zoomed = Paralaje solar (segundos de arco), ampliada en torno al valor final ± { $sigmas } incertidumbres
chart-convergence-iau = valor IAU 2009 { $value }"
chart-convergence-off-above = { $label } por encima, fuera de esta escala
chart-convergence-off-below = { $label } por debajo, fuera de esta escala
chart-convergence-sigma-axis = Su incertidumbre típica (segundos de arco, escala logarítmica)
chart-convergence-point = { $timings } tiempos: { $parallax }" ± { $sigma }"
chart-convergence-dashed = discontinua: cae como 1/√N hasta el valor final
