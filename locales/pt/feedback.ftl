# transit-parallax: mensagens (feedback) em português. REVISÃO PENDENTE: precisa da revisão de um falante nativo (translations want a native speaker's review).

## A diferença de um intervalo cronometrado para a sua previsão

later-than-predicted-interval = { $size } mais longo do que o intervalo previsto
earlier-than-predicted-interval = { $size } mais curto do que o intervalo previsto

## O que significa a diferença de um tempo

feedback-fits = { $diff }: dentro do que a incerteza do seu tempo permite
feedback-probably = { $diff }: provavelmente { $blunder }
feedback-more-than-stated = { $diff }: mais do que a incerteza que indicou ({ $sigma } s) permite
feedback-far-off = { $diff }: muito mais do que qualquer erro da previsão ou de um relógio
feedback-outside-years = o instante está fora dos anos que a ferramenta abrange
feedback-contact-not-seen = a sua estação não vê o contacto { $contact } deste trânsito (a trajetória do planeta vista daí não chega a esse círculo)
feedback-interval-not-seen = a sua estação não vê o intervalo { $interval } deste trânsito
feedback-sun-down = o Sol estava { $degrees } graus abaixo do horizonte na sua estação neste contacto
feedback-part-of-offset = { $diff }: parte do desvio que todos os seus tempos partilham, provavelmente { $cause } (dito uma vez, acima); sem ele, este tempo está a { $rest } s da sua previsão
feedback-submission-unread = o envio não pôde ser lido como tempos
feedback-row-unread = a linha não pode ser lida
unread-time-quoted = a hora «{ $time }» não pôde ser lida como data e hora
unread-time = uma hora não pôde ser lida como data e hora

## Os lapsos de um tempo (o que a própria redução encontra)

blunder-date-off = o tempo está a { $oc } s da sua previsão, a um dia dela com { $miss } s: a data está provavelmente desviada um dia ({ $late ->
    [yes] um dia atrasada
   *[no] um dia adiantada
  })
blunder-half-day = a diferença é de { $hours } h, meio dia: provavelmente confundiram-se a contagem civil e a astronómica do dia (um dia astronómico começa ao meio-dia: 3 de junho astronómico às 21 h é 4 de junho civil às 9 h; ponha day_reckoning em { $late ->
    [yes] civil se as linhas dizem astronómico
   *[no] astronomical se as linhas dizem civil
  }), ou manhã e tarde num relógio moderno
blunder-zone-hours = a diferença é de { $hours } h, um número inteiro de horas: provavelmente a hora local (do fuso) foi dada como UTC; { $subtract ->
    [yes] subtraia
   *[no] some
  } { $fix } h para a corrigir
blunder-half-hour-zone = a diferença é de { $hours } h, um número inteiro de meias horas: provavelmente ficou incluído um fuso horário de meia hora; { $subtract ->
    [yes] subtraia
   *[no] some
  } { $fix } h para a corrigir
blunder-contacts-exchanged = indicado como contacto { $labelled } mas corresponde ao contacto { $fits } nesta estação (diferença { $oc } s): os contactos { $first } e { $second } foram provavelmente trocados
blunder-minute-typo = a diferença é de { $oc } s, { $n ->
    [one] { $n } minuto inteiro
   *[other] { $n } minutos inteiros
  } com { $miss } s: provavelmente um algarismo dos minutos foi mal escrito; { $subtract ->
    [yes] subtraia
   *[no] some
  } { $n } min para a corrigir

## Um desvio que todos os tempos de uma estação partilham

offset-cause-date = uma data desviada { $n ->
    [one] { $n } dia
   *[other] { $n } dias
  }
offset-cause-zone = um fuso horário de { $hours } h que ficou incluído
offset-cause-clock = um relógio desviado cerca de { $seconds } s
all-your-timings = { $n ->
    [2] os seus dois tempos
   *[other] os seus { $n } tempos
  }
station-advice-date = { $all } estão cerca de { $days ->
    [one] { $days } dia
   *[other] { $days } dias
  } { $late ->
    [yes] atrasados
   *[no] adiantados
  }: a data está provavelmente errada; verifique a data que escreveu e envie-os de novo
station-advice-zone = { $all } estão cerca de { $hours } h { $late ->
    [yes] atrasados: o fuso horário do seu relógio ficou provavelmente incluído (hora local dada como UTC); subtraia { $hours } h
   *[no] adiantados: o fuso horário do seu relógio ficou provavelmente incluído (hora local dada como UTC); some { $hours } h
  } a cada um e envie-os de novo
station-advice-clock = { $all } estão cerca de { $seconds } s { $late ->
    [yes] atrasados: verifique o relógio com que cronometrou (acerte-o por um sinal horário ou GPS); se estava desviado tanto, subtraia { $seconds } s
   *[no] adiantados: verifique o relógio com que cronometrou (acerte-o por um sinal horário ou GPS); se estava desviado tanto, some { $seconds } s
  } a cada um e envie-os de novo

## O que fazer

advice-check-date = verifique a data
advice-check-contact-and-place = verifique o número do contacto e as coordenadas da sua estação (as latitudes sul e as longitudes oeste são negativas)
advice-check-place-and-date = verifique as coordenadas da sua estação (as longitudes oeste são negativas) e a data
advice-check-pair = verifique o par de contactos e as coordenadas da sua estação
advice-doubtful = verifique o relógio com que cronometrou e o número do contacto; se o tempo está certo tal como escrito, deixe-o: a solução pondera-o com os outros
advice-slip = corrija o tempo como indicado e envie-o de novo pelo seu link privado abaixo
advice-does-not-fit = verifique a data, o fuso horário (dê a hora em UTC) e o número do contacto
advice-see-station = veja acima o que mudar para toda a estação
advice-write-utc = escreva a data e a hora do dia em UTC, como { $example }
advice-correct-row = corrija a linha e envie-a de novo (horas em UTC, como { $example })
