# transit-parallax: mensajes (feedback) en español. REVISIÓN PENDIENTE: necesita la revisión de un hablante nativo (translations want a native speaker's review).

## La diferencia de un intervalo cronometrado con su predicción

later-than-predicted-interval = { $size } más largo que el intervalo predicho
earlier-than-predicted-interval = { $size } más corto que el intervalo predicho

## Lo que significa la diferencia de un tiempo

feedback-fits = { $diff }: dentro de lo que permite la incertidumbre de su tiempo
feedback-probably = { $diff }: probablemente { $blunder }
feedback-more-than-stated = { $diff }: más de lo que permite la incertidumbre que indicó ({ $sigma } s)
feedback-far-off = { $diff }: mucho más que cualquier error de la predicción o de un reloj
feedback-outside-years = el instante está fuera de los años que cubre la herramienta
feedback-contact-not-seen = su estación no ve el contacto { $contact } de este tránsito (la trayectoria del planeta vista desde allí no alcanza ese círculo)
feedback-interval-not-seen = su estación no ve el intervalo { $interval } de este tránsito
feedback-sun-down = el Sol estaba { $degrees } grados bajo el horizonte en su estación en este contacto
feedback-part-of-offset = { $diff }: parte del desfase que comparten todos sus tiempos, probablemente { $cause } (dicho una vez, arriba); sin él, este tiempo está a { $rest } s de su predicción
feedback-submission-unread = el envío no se pudo leer como tiempos
feedback-row-unread = la fila no se puede leer
unread-time-quoted = la hora «{ $time }» no se pudo leer como fecha y hora
unread-time = una hora no se pudo leer como fecha y hora

## Los descuidos de un tiempo (lo que encuentra la propia reducción)

blunder-date-off = el tiempo está a { $oc } s de su predicción, a un día de ella con { $miss } s: probablemente la fecha está desplazada un día ({ $late ->
    [yes] un día tarde
   *[no] un día antes
  })
blunder-half-day = la diferencia es de { $hours } h, medio día: probablemente se confundieron el cómputo civil y el astronómico del día (un día astronómico empieza a mediodía: el 3 de junio astronómico a las 21 h es el 4 de junio civil a las 9 h; ponga day_reckoning en { $late ->
    [yes] civil si las filas dicen astronómico
   *[no] astronomical si las filas dicen civil
  }), o a. m. y p. m. en un reloj moderno
blunder-zone-hours = la diferencia es de { $hours } h, un número entero de horas: probablemente se dio la hora local (de huso) como UTC; { $subtract ->
    [yes] reste
   *[no] sume
  } { $fix } h para corregirlo
blunder-half-hour-zone = la diferencia es de { $hours } h, un número entero de medias horas: probablemente quedó incluido un huso horario de media hora; { $subtract ->
    [yes] reste
   *[no] sume
  } { $fix } h para corregirlo
blunder-contacts-exchanged = marcado como contacto { $labelled } pero coincide con el contacto { $fits } en esta estación (diferencia { $oc } s): probablemente se intercambiaron los contactos { $first } y { $second }
blunder-minute-typo = la diferencia es de { $oc } s, { $n ->
    [one] { $n } minuto entero
   *[other] { $n } minutos enteros
  } con { $miss } s: probablemente se tecleó mal una cifra de los minutos; { $subtract ->
    [yes] reste
   *[no] sume
  } { $n } min para corregirlo

## Un desfase que comparten todos los tiempos de una estación

offset-cause-date = una fecha desplazada { $n ->
    [one] { $n } día
   *[other] { $n } días
  }
offset-cause-zone = un huso horario de { $hours } h que quedó incluido
offset-cause-clock = un reloj desviado unos { $seconds } s
all-your-timings = { $n ->
    [2] sus dos tiempos
   *[other] sus { $n } tiempos
  }
station-advice-date = { $all } van unos { $days ->
    [one] { $days } día
   *[other] { $days } días
  } { $late ->
    [yes] tarde
   *[no] adelantados
  }: probablemente la fecha está mal; revise la fecha que escribió y envíelos de nuevo
station-advice-zone = { $all } van unas { $hours } h { $late ->
    [yes] tarde: probablemente quedó incluido el huso horario de su reloj (hora local dada como UTC); reste { $hours } h
   *[no] adelantados: probablemente quedó incluido el huso horario de su reloj (hora local dada como UTC); sume { $hours } h
  } a cada uno y envíelos de nuevo
station-advice-clock = { $all } van unos { $seconds } s { $late ->
    [yes] tarde: revise el reloj con el que cronometró (póngalo en hora con una señal horaria o GPS); si iba desviado tanto, reste { $seconds } s
   *[no] adelantados: revise el reloj con el que cronometró (póngalo en hora con una señal horaria o GPS); si iba desviado tanto, sume { $seconds } s
  } a cada uno y envíelos de nuevo

## Qué hacer

advice-check-date = revise la fecha
advice-check-contact-and-place = revise el número del contacto y las coordenadas de su estación (las latitudes sur y las longitudes oeste son negativas)
advice-check-place-and-date = revise las coordenadas de su estación (las longitudes oeste son negativas) y la fecha
advice-check-pair = revise el par de contactos y las coordenadas de su estación
advice-doubtful = revise el reloj con el que cronometró y el número del contacto; si el tiempo es correcto tal como está escrito, déjelo: la solución lo pondera con los demás
advice-slip = corrija el tiempo como se indica y envíelo de nuevo con su enlace privado de abajo
advice-does-not-fit = revise la fecha, el huso horario (dé la hora en UTC) y el número del contacto
advice-see-station = vea arriba qué cambiar para toda la estación
advice-write-utc = escriba la fecha y la hora del día en UTC, como { $example }
advice-correct-row = corrija la fila y envíela de nuevo (horas en UTC, como { $example })
