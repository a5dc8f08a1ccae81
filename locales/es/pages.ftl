# transit-parallax: las páginas de los participantes en español.
# REVISIÓN PENDIENTE: traducción hecha por los desarrolladores del proyecto; necesita la
# revisión de un hablante nativo (translations want a native speaker's review).
# Variables: $n es un recuento (elige la forma del plural); los demás valores llegan como
# texto, con los números ya escritos para el idioma.

## El marco de cada página

skip-link = Saltar al contenido
site-line = tiempos en común
solar-caution = PRECAUCIÓN: mirar al Sol puede causar ceguera. No mire nunca al Sol, ni un instante ni parcialmente cubierto, sin un filtro solar certificado en la parte delantera del telescopio o ante el ojo, o mire su imagen proyectada en una pantalla. No mire nunca por un buscador óptico: tápelo o retírelo. Siga las indicaciones locales, las normas de su lugar y las instrucciones de un supervisor con experiencia.
footer-line = transit-parallax { $version }: tiempos de contacto reunidos para la paralaje solar. Estas páginas no cargan nada de otro sitio y no ejecutan ningún script.
language-switch = Idioma
back-to-form = Volver al formulario

## El formulario del participante

form-title = Envíe sus tiempos
form-intro = Envíe los instantes de contacto que observó del tránsito de { $planet ->
        [venus] Venus
       *[other] Mercurio
    } del { $date }. Verá al momento cómo se compara cada uno con su predicción en su estación.
form-before-and-after = Antes del evento, <a href="/register">registre su estación</a> para obtener su hoja de observación y su calendario; <a href="/results">los resultados hasta ahora</a> son públicos.
station-heading = Su estación
station-name = Nombre de la estación
station-name-hint = tal como quiere que aparezca
latitude = Latitud (grados)
latitude-hint = norte positiva, sur negativa: { $example }
longitude = Longitud (grados)
longitude-hint = este positiva, oeste negativa: { $example }
elevation = Altitud (metros)
elevation-hint = sobre el nivel del mar
longitude-sigma = Incertidumbre de la longitud (grados)
longitude-sigma-hint = o la palabra unknown; déjelo vacío si la longitud es exacta
timings-heading = Sus tiempos
timings-note = Un bloque por cada contacto que cronometró; deje los demás en «no cronometrado».
timing-legend = Tiempo { $number }
contact = Contacto
contact-none = no cronometrado
contact-1 = I: ingreso exterior (primer toque)
contact-2 = II: ingreso interior (por completo sobre el Sol)
contact-3 = III: egreso interior (empieza a salir)
contact-4 = IV: egreso exterior (último toque)
time-utc = Hora (UTC)
time-utc-hint = fecha y hora con Z: { $example }
sigma = Incertidumbre (segundos)
sigma-hint = cuánta seguridad tiene de la hora; vacío: la habitual para ese contacto
local-summary = ¿Cronometrado en hora solar local (un registro antiguo)?
time-local = Hora solar local
time-local-hint = en lugar de UTC, sin zona: { $example }
local-kind = Tipo de hora local
local-kind-none = ninguno (la hora es UTC)
local-kind-apparent = verdadera (hora de reloj de sol)
local-kind-mean = media (hora media local)
day-reckoning = Cómputo del día
day-civil = civil (desde medianoche)
day-astronomical = astronómico (desde mediodía)
as-sent = tal como se envió: { $value }
send-timings = Enviar estos tiempos
paste-legend = O pegue un archivo de observaciones
paste-label = Observaciones (CSV)
paste-hint = con las columnas { $columns }
send-paste = Enviar el archivo pegado
upload-legend = O envíe un archivo de observaciones
upload-label = Archivo
upload-hint = CSV con las columnas de arriba, o una hoja de cálculo .xlsx u .ods
send-file = Enviar el archivo
limits = Límites: un archivo pegado o enviado puede tener hasta { $kb } KB (unas { $rows } filas); divida un archivo más largo en partes y envíe cada una. Cada parte es un envío propio; los tiempos de una estación en varias partes se reúnen.

## La respuesta tras un envío

feedback-title = Gracias: sus tiempos
feedback-title-unread = No se pudieron leer sus tiempos
feedback-duplicate = Es igual a un envío ya recibido; no se contó dos veces.
feedback-received = Recibido y guardado como envío { $id }: { $n ->
    [one] { $n } tiempo leído.
   *[other] { $n } tiempos leídos.
  }
feedback-some-unread = { $n ->
    [one] { $n } fila no se pudo leer: vea abajo.
   *[other] { $n } filas no se pudieron leer: vea abajo.
  }
feedback-none-read = Guardamos lo que envió (como envío { $id }) para que el organizador pueda verlo, pero ninguna de sus { $n ->
    [one] { $n } fila
   *[other] { $n } filas
  } se pudo leer como un tiempo. Abajo, bajo cada fila: qué no se pudo leer y qué cambiar. Después envíe los tiempos de nuevo.
feedback-private-link = Para revisar o corregir su envío más tarde, guarde este enlace privado:
feedback-versions = Una corrección se guarda como una versión nueva; la anterior se conserva.
send-another = Enviar otro
all-together = Todos sus tiempos juntos: { $station }
each-timing = Cada tiempo
card-contact = Contacto { $contact }
card-contact-none = (no indicado)
card-station = Estación
card-your-time = Su hora
card-predicted = Predicha
card-difference = Diferencia
card-sun-altitude = Altura del Sol
card-sun-altitude-value = { $degrees } grados
card-verdict = Veredicto
card-meaning = Qué significa
card-what-to-do = Qué hacer
card-nothing-to-do = nada: gracias
verdict-fits = concuerda
verdict-doubtful = dudoso
verdict-does-not-fit = no concuerda
verdict-unread = no se pudo leer
later-than-predicted = { $size } más tarde de lo predicho
earlier-than-predicted = { $size } antes de lo predicho
share-later = Su parte de la información de la campaña sobre la paralaje solar se mostrará cuando al menos { $min } estaciones hayan enviado tiempos ({ $so_far } hasta ahora): la paralaje se mide comparando estaciones.
share-none = Estos tiempos aún no aportan información sobre la paralaje (ninguno se pudo usar).
share-value = Parte esperada de su estación en la información de la campaña sobre la paralaje solar hasta ahora: { $percent } % (antes de ajustar la posición del planeta y los radios).

## La revisión del propio envío, y los rechazos

review-title = Su envío { $id }
review-correct-heading = Corregirlo
review-correct-note = Al enviar este formulario se guarda una versión nueva; la anterior se conserva.
review-superseded = Esta versión ha sido corregida por otra posterior.
not-found = No encontrado
not-found-submission = Ningún envío corresponde a este enlace.
refused = Rechazado
refused-not-in-force = Este enlace no abre un envío vigente.
not-received = No recibido
choose-a-file = Elija un archivo para enviar.
not-read = No leído
stored-as-it-came = Lo que envió se guardó tal como llegó, y el organizador puede verlo.
verdict-slip = probablemente un descuido que puede corregir

## Cómo se hicieron los tiempos

how-heading = Cómo cronometró
observer = Observador
observer-hint = su nombre o el de su grupo; opcional
clock-source = Reloj del que leyó la hora
instrument = Instrumento
instrument-hint = p. ej. refractor de 80 mm
aperture = Abertura (milímetros)
aperture-hint = el diámetro de la lente o del espejo
viewing = Cómo vio el Sol
notes = Notas
notes-hint = seeing, nubes, cualquier cosa que el organizador deba saber
not-said = sin indicar
clock-gps = receptor GPS
clock-radio = señal horaria por radio
clock-network = ordenador con hora de red
clock-phone = teléfono móvil
clock-other = otro (un reloj puesto a mano)
viewing-filter = filtro solar certificado delante
viewing-projection = proyección sobre una pantalla

## Registrar una estación antes del evento

register-title = Registre su estación
register-intro = Registre su estación antes del tránsito: recibirá al momento un enlace privado a su hoja de observación (los contactos en la hora de su propio reloj, una tabla en blanco para los tiempos) y un calendario de los contactos para su teléfono. Después del evento, envíe sus tiempos con el mismo nombre de estación, y el organizador verá que su estación informó.
register-refused = No registrada:
register-name-hint = tal como quiere que aparezca; envíe sus tiempos con el mismo nombre
register-elevation-hint = sobre el nivel del mar; vacío: 0
register-zone = Zona horaria de sus relojes
register-zone-hint = un nombre como Europe/Madrid, America/Mexico_City o America/Bogota, o un desfase como -05:00
register-button = Registrar la estación
register-privacy = El nombre de su estación y su posición redondeada a una décima de grado pueden aparecer en la página pública de resultados; el enlace privado es solo suyo.

## La página privada de una estación registrada

registered-title = Registrada: { $station }
registered-private-link-html = Su enlace privado: <a id="private" href="{ $href }">{ $href }</a>. Guárdelo: vuelve a abrir su hoja y su calendario, y cualquiera que lo tenga también puede.
registered-sheet-html = <a id="sheet" href="{ $href }">Su hoja de observación</a>: una página para imprimir con los contactos en la hora de su reloj y una tabla para sus tiempos.
registered-calendar-html = <a id="calendar" href="{ $href }" download="{ $file }">Su calendario de los contactos</a> (.ics, con recordatorios) para un teléfono o un programa de calendario.
registered-station-heading = Su estación
registered-station = { $station }: latitud { $latitude }°, longitud { $longitude }°, altitud { $elevation } m; relojes en { $zone }.
registered-contacts-heading = Los contactos allí
registered-contact = Contacto { $contact }: { $clock } ({ $utc } UTC), { $sun }
registered-sun-up = el Sol a { $degrees }° de altura
registered-sun-down = el Sol bajo el horizonte: no visible
registered-no-contact = Ningún contacto de este tránsito ocurre en este lugar.
registered-after-html = Después del evento, <a href="/">envíe sus tiempos</a> con el mismo nombre de estación.
not-found-registration = Ningún registro corresponde a este enlace.
