# transit-parallax: mensajes (sheet) en español. REVISIÓN PENDIENTE: necesita la revisión de un hablante nativo (translations want a native speaker's review).
# La hoja del observador (`predict --sheets`, la hoja de una estación registrada en el servicio) y su calendario.
# Los mensajes cuyo id termina en -html son HTML: se escriben tal cual (conserve sus etiquetas
# y entidades). $planet es venus o mercury; $n es una cantidad (elige la forma del plural);
# los números y las fechas llegan ya escritos para la lengua; las horas siguen en 24 horas.

## El encabezado

sheet-title =
    { $planet ->
        [venus] Tránsito de Venus
       *[other] Tránsito de Mercurio
    }, { $date }: { $station }
sheet-station-html = Estación: <b>{ $station }</b>, latitud { $latitude }°, longitud { $longitude }° (positiva al este), altitud { $elevation } m.
sheet-zone-html = Horas del reloj en <b>{ $zone }</b>: { $abbreviation } (UTC{ $offset }) durante el tránsito; al lado, UTC.
sheet-no-zone-html = No se dio ninguna zona horaria para esta estación, así que las horas están <b>solo en UTC</b>. Para tenerlas en la hora de su reloj, ejecute <code>predict</code> de nuevo con <code>--time-zone ZONA</code> (p. ej. <code>Europe/Madrid</code> o <code>+05:30</code>) o añada una columna <code>time_zone</code> al archivo de estaciones.

## Los cuatro contactos

sheet-contacts-heading = Los cuatro contactos
sheet-col-contact = Contacto
sheet-col-your-clock = Su reloj
sheet-col-sun-altitude = Altura del Sol
sheet-col-sun-azimuth = Acimut del Sol
sheet-col-position-angle = Ángulo de posición
sheet-col-vertex-angle = Ángulo de vértice
sheet-col-seen = ¿Visible?
sheet-no-such-contact = este contacto no ocurre en esta estación (tránsito rasante)
sheet-seen-yes = sí, Sol arriba
sheet-seen-no = no, bajo el horizonte
sheet-contacts-note = Las horas están redondeadas al segundo. Son los contactos geométricos ideales (I, II: ingreso exterior e interior; III, IV: egreso interior y exterior), predichos con ±{ $sigma } s a partir de la efeméride, con Delta T { $delta_t } s (véase el pie de la página); lo que usted vea puede diferir en varios segundos (la gota negra, la turbulencia, su reloj). Altura: altura verdadera del centro del Sol (sin refracción); acimut desde el norte hacia el este. Visible: el borde superior del Sol sobre el horizonte (altura verdadera mayor que −0°50′).

## Salida y puesta del Sol

sheet-sun-heading = Salida y puesta del Sol:
sheet-sun-up-throughout = El Sol permanece sobre el horizonte durante todo el tránsito.
sheet-sun-down-throughout = El Sol está bajo el horizonte durante todo el tránsito: desde aquí no se puede ver nada.
sheet-sun-rises-html = El Sol sale durante el tránsito, a las { $time }.
sheet-sun-sets-html = El Sol se pone durante el tránsito, a las { $time }.
sheet-sun-note = (borde superior en el horizonte, altura estándar −0°50′, Meeus cap. 15; sin tener en cuenta la altitud de la estación)

## Dónde mirar en el borde del Sol

sheet-drawings-heading = Dónde mirar en el borde del Sol
sheet-zenith-caption-1 = En el cielo: cenit arriba
sheet-zenith-caption-2 = (ángulo de vértice)
sheet-north-caption-1 = Montura ecuatorial:
sheet-north-caption-2 = N arriba, E a la izquierda (ángulo de posición)
sheet-drawings-note = El ángulo de posición se cuenta desde el punto norte del disco hacia el este; el ángulo de vértice, desde el punto más cercano al cenit hacia el este; ambos en sentido antihorario aquí, como se ve el cielo directamente. Un espejo diagonal invierte la imagen y una pantalla de proyección puede invertirla o girarla: compruebe hacia dónde se desplaza el Sol antes del tránsito.
limb-zenith-label = Disco solar tal como se ve en el cielo, cenit arriba
limb-north-label = Disco solar con el norte arriba y el este a la izquierda
limb-zenith = Cenit
limb-north = N
limb-east = E

## La tabla en blanco para los tiempos

sheet-timings-heading = Sus tiempos
sheet-col-clock-time = Hora del reloj (hh:mm:ss.s)
sheet-col-zone = Zona o desfase
sheet-col-sure-html = Precisión&nbsp;±&nbsp;s
sheet-col-observer = Observador
sheet-col-what-seen = Lo que vio (gota negra, nubes)
sheet-fill-observers = Observador(es):
sheet-fill-instrument = Instrumento, abertura (mm), filtro o proyección:
sheet-fill-clock = Reloj puesto en hora con (GPS, radio, teléfono), su error:
sheet-reduce-note-html = Para <code>reduce</code>, copie cada fila en un archivo de observaciones (<code>transit-parallax template observations</code>): contact, time_utc (o la hora del reloj con su desfase, 2032-11-13T07:43:40.5+01:00), sigma_s (qué tan seguro) y observer.

## El pie de la página

sheet-calendar-empty = Ninguno de los contactos se ve desde aquí con el Sol sobre el horizonte, así que el calendario { $file } no contiene eventos.
sheet-calendar-holds =
    El calendario { $file } contiene { $n ->
        [one] el contacto visible
       *[other] los { $n } contactos visibles
    } con el Sol sobre el horizonte, con recordatorios.
sheet-computed = Calculado por transit-parallax { $version } con la efeméride { $ephemeris }; Delta T { $delta_t } s.

## Delta T

sheet-delta-t-fixed-value = { $value }, fijado
sheet-delta-t-fixed = Delta T fijado con --delta-t.
sheet-delta-t-from = Delta T según { $source }.
sheet-delta-t-source-leap-seconds = la tabla de segundos intercalares y el DUT1 dado
sheet-delta-t-source-reconstruction = la reconstrucción de Morrison, Stephenson, Hohenkerk y Zawilski (2021)
sheet-delta-t-source-observed = las observaciones del IERS
sheet-delta-t-source-predicted = las predicciones del Boletín A del IERS
sheet-delta-t-source-extrapolated = una extrapolación: el valor central de tres predicciones publicadas, con la mitad de su dispersión como incertidumbre
sheet-times-utc-hardly = Las horas están en UTC; la incertidumbre de Delta T apenas mueve los contactos.
sheet-times-ut1 = Las horas están en UT1, que es TT - Delta T: un error en Delta T mueve cada hora impresa aproximadamente lo mismo.
sheet-times-utc = Las horas están en UTC.
sheet-times-utc-held = Las horas están en UTC con TAI - UTC fijo en su último valor, de modo que siguen ligadas a TT: un error en Delta T solo las mueve a través de la rotación de la Tierra bajo el evento (segundos por minutos de Delta T), mientras que el UT1 de cada contacto, y cualquier segundo intercalar aún por venir, se movería el error entero.

## El calendario (.ics)

calendar-summary =
    { $planet ->
        [venus] Tránsito de Venus
       *[other] Tránsito de Mercurio
    }: contacto { $contact } ({ $station })
calendar-clock-time = Hora del reloj { $time } ({ $abbreviation }).
calendar-description =
    Contacto { $contact } del tránsito de { $planet ->
        [venus] Venus
       *[other] Mercurio
    } en { $station }: { $clock }UTC { $utc }. Altura del Sol { $altitude } grados, ángulo de posición { $position_angle }, ángulo de vértice { $vertex_angle }.
calendar-reminder =
    Contacto { $contact } del tránsito de { $planet ->
        [venus] Venus
       *[other] Mercurio
    } dentro de { $n } minutos
