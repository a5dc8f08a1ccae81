# transit-parallax: as páginas dos participantes em português.
# REVISÃO PENDENTE: tradução feita pelos desenvolvedores do projeto; precisa da revisão de um
# falante nativo (translations want a native speaker's review).
# Variáveis: $n é uma contagem (escolhe a forma do plural); os outros valores chegam como
# texto, com os números já escritos para a língua.

## A moldura de cada página

skip-link = Saltar para o conteúdo
site-line = tempos em comum
solar-caution = CUIDADO: olhar para o Sol pode cegar. Nunca olhe para o Sol, nem por um instante nem parcialmente encoberto, sem um filtro solar certificado na frente do telescópio ou diante do olho, ou veja a sua imagem projetada num ecrã. Nunca olhe por um buscador ótico: tape-o ou retire-o. Siga as orientações locais, as regras do seu local e as instruções de um supervisor experiente.
footer-line = transit-parallax { $version }: tempos de contacto reunidos para a paralaxe solar. Estas páginas não carregam nada de outro sítio e não executam nenhum script.
language-switch = Língua
back-to-form = Voltar ao formulário

## O formulário do participante

form-title = Envie os seus tempos
form-intro = Envie os instantes de contacto que observou do trânsito de { $planet ->
        [venus] Vénus
       *[other] Mercúrio
    } de { $date }. Verá de imediato como cada um se compara com a sua previsão na sua estação.
form-before-and-after = Antes do evento, <a href="/register">registe a sua estação</a> para obter a sua folha de observação e o seu calendário; <a href="/results">os resultados até agora</a> são públicos.
station-heading = A sua estação
station-name = Nome da estação
station-name-hint = como quer que apareça
latitude = Latitude (graus)
latitude-hint = norte positiva, sul negativa: { $example }
longitude = Longitude (graus)
longitude-hint = leste positiva, oeste negativa: { $example }
elevation = Altitude (metros)
elevation-hint = acima do nível do mar
longitude-sigma = Incerteza da longitude (graus)
longitude-sigma-hint = ou a palavra unknown; deixe vazio se a longitude for exata
timings-heading = Os seus tempos
timings-note = Um bloco por cada contacto cronometrado; deixe os outros em «não cronometrado».
timing-legend = Tempo { $number }
contact = Contacto
contact-none = não cronometrado
contact-1 = I: ingresso exterior (primeiro toque)
contact-2 = II: ingresso interior (todo sobre o Sol)
contact-3 = III: egresso interior (começa a sair)
contact-4 = IV: egresso exterior (último toque)
time-utc = Hora (UTC)
time-utc-hint = data e hora com Z: { $example }
sigma = Incerteza (segundos)
sigma-hint = quão seguro está da hora; vazio: a habitual para esse contacto
local-summary = Cronometrado em tempo solar local (um registo antigo)?
time-local = Tempo solar local
time-local-hint = em vez de UTC, sem fuso: { $example }
local-kind = Tipo de tempo local
local-kind-none = nenhum (a hora é UTC)
local-kind-apparent = verdadeiro (hora de relógio de sol)
local-kind-mean = médio (tempo médio local)
day-reckoning = Contagem do dia
day-civil = civil (desde a meia-noite)
day-astronomical = astronómico (desde o meio-dia)
as-sent = tal como enviado: { $value }
send-timings = Enviar estes tempos
paste-legend = Ou cole um ficheiro de observações
paste-label = Observações (CSV)
paste-hint = com as colunas { $columns }
send-paste = Enviar o ficheiro colado
upload-legend = Ou envie um ficheiro de observações
upload-label = Ficheiro
upload-hint = CSV com as colunas acima, ou uma folha de cálculo .xlsx ou .ods
send-file = Enviar o ficheiro
limits = Limites: um ficheiro colado ou enviado pode ter até { $kb } KB (cerca de { $rows } linhas); divida um ficheiro maior em partes e envie cada uma. Cada parte é um envio próprio; os tempos de uma estação em várias partes são reunidos.

## A resposta depois de um envio

feedback-title = Obrigado: os seus tempos
feedback-title-unread = Não foi possível ler os seus tempos
feedback-duplicate = É igual a um envio já recebido; não foi contado duas vezes.
feedback-received = Recebido e guardado como envio { $id }: { $n ->
    [one] { $n } tempo lido.
   *[other] { $n } tempos lidos.
  }
feedback-some-unread = { $n ->
    [one] { $n } linha não pôde ser lida: veja abaixo.
   *[other] { $n } linhas não puderam ser lidas: veja abaixo.
  }
feedback-none-read = Guardámos o que enviou (como envio { $id }) para que a organização o possa ver, mas nenhuma das suas { $n ->
    [one] { $n } linha
   *[other] { $n } linhas
  } pôde ser lida como um tempo. Abaixo, sob cada linha: o que não pôde ser lido e o que mudar. Depois envie os tempos de novo.
feedback-private-link = Para rever ou corrigir o seu envio mais tarde, guarde esta ligação privada:
feedback-versions = Uma correção é guardada como uma versão nova; a anterior é mantida.
send-another = Enviar outro
all-together = Todos os seus tempos juntos: { $station }
each-timing = Cada tempo
card-contact = Contacto { $contact }
card-contact-none = (não indicado)
card-station = Estação
card-your-time = A sua hora
card-predicted = Prevista
card-difference = Diferença
card-sun-altitude = Altura do Sol
card-sun-altitude-value = { $degrees } graus
card-verdict = Veredicto
card-meaning = O que significa
card-what-to-do = O que fazer
card-nothing-to-do = nada: obrigado
verdict-fits = concorda
verdict-doubtful = duvidoso
verdict-does-not-fit = não concorda
verdict-unread = ilegível
later-than-predicted = { $size } mais tarde do que o previsto
earlier-than-predicted = { $size } mais cedo do que o previsto
share-later = A sua parte da informação da campanha sobre a paralaxe solar aparecerá quando pelo menos { $min } estações tiverem enviado tempos ({ $so_far } até agora): a paralaxe mede-se comparando estações.
share-none = Estes tempos ainda não trazem informação sobre a paralaxe (nenhum pôde ser usado).
share-value = Parte esperada da sua estação na informação da campanha sobre a paralaxe solar até agora: { $percent } % (antes de ajustar a posição do planeta e os raios).

## A revisão do próprio envio, e as recusas

review-title = O seu envio { $id }
review-correct-heading = Corrigi-lo
review-correct-note = Enviar este formulário guarda uma versão nova; a anterior é mantida.
review-superseded = Esta versão foi corrigida por uma posterior.
not-found = Não encontrado
not-found-submission = Nenhum envio corresponde a esta ligação.
refused = Recusado
refused-not-in-force = Esta ligação não abre um envio em vigor.
not-received = Não recebido
choose-a-file = Escolha um ficheiro para enviar.
not-read = Não lido
stored-as-it-came = O que enviou foi guardado tal como chegou, e a organização pode vê-lo.
verdict-slip = provavelmente um lapso que pode corrigir

## Como os tempos foram feitos

how-heading = Como cronometrou
observer = Observador
observer-hint = o seu nome ou o do seu grupo; opcional
clock-source = Relógio de onde leu a hora
instrument = Instrumento
instrument-hint = p. ex. refrator de 80 mm
aperture = Abertura (milímetros)
aperture-hint = o diâmetro da lente ou do espelho
viewing = Como viu o Sol
notes = Notas
notes-hint = turbulência, nuvens, tudo o que a organização deva saber
not-said = não indicado
clock-gps = recetor GPS
clock-radio = sinal horário por rádio
clock-network = computador com hora da rede
clock-phone = telemóvel
clock-other = outro (um relógio acertado à mão)
viewing-filter = filtro solar certificado à frente
viewing-projection = projeção num ecrã

## Registar uma estação antes do evento

register-title = Registe a sua estação
register-intro = Registe a sua estação antes do trânsito: recebe de imediato uma ligação privada para a sua folha de observação (os contactos na hora do seu próprio relógio, uma tabela em branco para os tempos) e um calendário dos contactos para o seu telemóvel. Depois do evento, envie os seus tempos com o mesmo nome de estação, e a organização verá que a sua estação respondeu.
register-refused = Não registada:
register-name-hint = como quer que apareça; envie os seus tempos com o mesmo nome
register-elevation-hint = acima do nível do mar; vazio: 0
register-zone = Fuso horário dos seus relógios
register-zone-hint = um nome como Europe/Lisbon, America/Sao_Paulo ou Africa/Luanda, ou um desvio como -03:00
register-button = Registar a estação
register-privacy = O nome da sua estação e a sua posição arredondada a uma décima de grau podem aparecer na página pública de resultados; a ligação privada é só sua.

## A página privada de uma estação registada

registered-title = Registada: { $station }
registered-private-link-html = A sua ligação privada: <a id="private" href="{ $href }">{ $href }</a>. Guarde-a: volta a abrir a sua folha e o seu calendário, e qualquer pessoa que a tenha também pode.
registered-sheet-html = <a id="sheet" href="{ $href }">A sua folha de observação</a>: uma página para imprimir com os contactos na hora do seu relógio e uma tabela para os seus tempos.
registered-calendar-html = <a id="calendar" href="{ $href }" download="{ $file }">O seu calendário dos contactos</a> (.ics, com lembretes) para um telemóvel ou um programa de calendário.
registered-station-heading = A sua estação
registered-station = { $station }: latitude { $latitude }°, longitude { $longitude }°, altitude { $elevation } m; relógios em { $zone }.
registered-contacts-heading = Os contactos aí
registered-contact = Contacto { $contact }: { $clock } ({ $utc } UTC), { $sun }
registered-sun-up = o Sol a { $degrees }° de altura
registered-sun-down = o Sol abaixo do horizonte: não visível
registered-no-contact = Nenhum contacto deste trânsito ocorre neste lugar.
registered-after-html = Depois do evento, <a href="/">envie os seus tempos</a> com o mesmo nome de estação.
not-found-registration = Nenhum registo corresponde a esta ligação.
