# transit-parallax: mensagens (results) em português. REVISÃO PENDENTE: precisa da revisão de um falante nativo (translations want a native speaker's review).

## A página pública de resultados (/results)

results-title = Resultados: a paralaxe solar até agora
results-not-determined = A paralaxe solar e a unidade astronómica ainda não estão determinadas: { $why }.
results-no-timing-reduced = ainda não foi reduzido nenhum tempo
results-no-timings-arrived = ainda não chegou nenhum tempo
results-first-being-computed = a primeira solução está a ser calculada
results-parallax = paralaxe solar
results-au = unidade astronómica
results-timings-used = tempos usados
results-used-of = { $used } de { $total }
results-au-value = { $au } ± { $sigma } milhões de km (95 %: de { $lo } a { $hi } milhões de km)
results-au-value-open = { $au } ± { $sigma } milhões de km (95 %: a partir de { $lo } milhões de km, sem limite superior)
results-au-not-given = não indicada: o intervalo de um sigma da paralaxe chega a zero, por isso os tempos não lhe impõem limite superior
results-parallax-not-determined = A paralaxe solar ainda não está determinada, nem portanto a unidade astronómica: { $why }.
results-default-why = os tempos em vigor não a determinam
results-need-two-none = São precisos tempos de pelo menos duas estações muito afastadas; nenhuma estação enviou ainda tempos utilizáveis.
results-need-two-one = São precisos tempos de pelo menos duas estações muito afastadas; até agora só uma estação enviou tempos utilizáveis.
results-counts = Estações: { $stations }; tempos em vigor: { $timings }; envios: { $submissions }.
results-stations-heading = As estações
results-map-caption = As estações, cada uma no seu lugar arredondado a 0,1 grau.
results-col-station = estação
results-col-latitude = latitude (0,1°)
results-col-longitude = longitude (0,1°)
results-col-timings = tempos usados
results-col-share = parte da informação
results-share-not-determined = não determinada
results-share-none = nenhuma
results-convergence-heading = Como a solução convergiu
results-convergence-caption = A paralaxe solar e a sua incerteza à medida que os tempos são acrescentados.
results-convergence-older = Desenhado para uma versão anterior dos dados ({ $version }); a mais recente está a ser desenhada.
results-links = <a href="/register">Inscrever uma estação</a> · <a href="/">Enviar os seus tempos</a>

## A frase «à data de»

as-of-none = Ainda não foi calculada nenhuma solução
as-of-solution = Solução à data de { $when } UTC (versão { $version } dos dados)
as-of-settled = { $solution }; inclui todos os tempos recebidos.
as-of-pending = { $solution }; { $n ->
    [one] 1 alteração mais recente (um envio, uma correção ou uma exclusão) está a ser reduzida.
   *[other] { $n } alterações mais recentes (envios, correções ou exclusões) estão a ser reduzidas.
  }

## Os gráficos da página de resultados

chart-map-title = Mapa-múndi das estações
chart-map-not-used = { $station } (n.º { $number }): não usada: { $why }
chart-map-station = { $station } (n.º { $number }): parte { $share }, z médio { $z }
chart-map-colour-key = cor: média de (O - C)/σ
chart-map-area-key = área: parte da informação
chart-convergence-title = Convergência da paralaxe solar
chart-convergence-too-few = Tempos a menos para seguir a solução à medida que são acrescentados.
chart-convergence-timings-axis = tempos na solução (pela ordem do ficheiro)
chart-convergence-zoomed = Paralaxe solar (segundos de arco), ampliada em torno do valor final ± { $sigmas } incertezas
chart-convergence-iau = valor UAI 2009 { $value }"
chart-convergence-off-above = { $label } acima, fora desta escala
chart-convergence-off-below = { $label } abaixo, fora desta escala
chart-convergence-sigma-axis = A sua incerteza-padrão (segundos de arco, escala logarítmica)
chart-convergence-point = { $timings } tempos: { $parallax }" ± { $sigma }"
chart-convergence-dashed = tracejado: desce como 1/√N até ao valor final
