# transit-parallax: mensagens (sheet) em português. REVISÃO PENDENTE: precisa da revisão de um falante nativo (translations want a native speaker's review).
# A folha do observador (`predict --sheets`, a folha de uma estação registada no serviço) e o seu calendário.
# As mensagens cujo identificador termina em -html são HTML, escritas tal como estão (mantenha
# as etiquetas e entidades). $planet é venus ou mercury; $n é uma quantidade (escolhe a forma
# do plural); números e datas chegam já escritos para a língua; as horas ficam em 24 horas.

## O cabeçalho

sheet-title =
    { $planet ->
        [venus] Trânsito de Vénus
       *[other] Trânsito de Mercúrio
    }, { $date }: { $station }
sheet-station-html = Estação: <b>{ $station }</b>, latitude { $latitude }°, longitude { $longitude }° (positiva para leste), altitude { $elevation } m.
sheet-zone-html = Horas do relógio em <b>{ $zone }</b>: { $abbreviation } (UTC{ $offset }) durante o trânsito; ao lado, UTC.
sheet-no-zone-html = Não foi dado nenhum fuso horário para esta estação, por isso as horas estão <b>só em UTC</b>. Para as ter na hora do seu relógio, execute de novo <code>predict</code> com <code>--time-zone FUSO</code> (p. ex. <code>Europe/Lisbon</code> ou <code>+05:30</code>) ou acrescente uma coluna <code>time_zone</code> ao ficheiro das estações.

## Os quatro contactos

sheet-contacts-heading = Os quatro contactos
sheet-col-contact = Contacto
sheet-col-your-clock = O seu relógio
sheet-col-sun-altitude = Altura do Sol
sheet-col-sun-azimuth = Azimute do Sol
sheet-col-position-angle = Ângulo de posição
sheet-col-vertex-angle = Ângulo de vértice
sheet-col-seen = Visível?
sheet-no-such-contact = este contacto não ocorre nesta estação (trânsito rasante)
sheet-seen-yes = sim, Sol acima
sheet-seen-no = não, sob o horizonte
sheet-contacts-note = As horas estão arredondadas ao segundo. São os contactos geométricos ideais (I, II: entrada exterior e interior; III, IV: saída interior e exterior), previstos com ±{ $sigma } s a partir da efeméride, com Delta T { $delta_t } s (ver o rodapé da página); o que vir pode diferir em vários segundos (a gota negra, a turbulência, o seu relógio). Altura: altura verdadeira do centro do Sol (sem refração); azimute a partir do norte, por leste. Visível: o bordo superior do Sol acima do horizonte (altura verdadeira acima de −0°50′).

## Nascer e pôr do Sol

sheet-sun-heading = Nascer e pôr do Sol:
sheet-sun-up-throughout = O Sol fica acima do horizonte durante todo o trânsito.
sheet-sun-down-throughout = O Sol está abaixo do horizonte durante todo o trânsito: daqui não se vê nada dele.
sheet-sun-rises-html = O Sol nasce durante o trânsito, às { $time }.
sheet-sun-sets-html = O Sol põe-se durante o trânsito, às { $time }.
sheet-sun-note = (bordo superior no horizonte, altura padrão −0°50′, Meeus cap. 15; sem contar a altitude da estação)

## Onde olhar no bordo do Sol

sheet-drawings-heading = Onde olhar no bordo do Sol
sheet-zenith-caption-1 = No céu: zénite em cima
sheet-zenith-caption-2 = (ângulo de vértice)
sheet-north-caption-1 = Montagem equatorial:
sheet-north-caption-2 = N em cima, E à esquerda (ângulo de posição)
sheet-drawings-note = O ângulo de posição conta-se a partir do ponto norte do disco, por leste; o ângulo de vértice, a partir do ponto mais próximo do zénite, por leste; ambos aqui no sentido anti-horário, como se vê o céu diretamente. Um espelho diagonal inverte a imagem e um ecrã de projeção pode invertê-la ou rodá-la: verifique para que lado o Sol se desloca antes do trânsito.
limb-zenith-label = Disco solar tal como se vê no céu, zénite em cima
limb-north-label = Disco solar com o norte em cima e o leste à esquerda
limb-zenith = Zénite
limb-north = N
limb-east = E

## A tabela em branco para os tempos

sheet-timings-heading = Os seus tempos
sheet-col-clock-time = Hora do relógio (hh:mm:ss.s)
sheet-col-zone = Fuso ou desvio
sheet-col-sure-html = Certeza&nbsp;±&nbsp;s
sheet-col-observer = Observador
sheet-col-what-seen = O que viu (gota negra, nuvens)
sheet-fill-observers = Observador(es):
sheet-fill-instrument = Instrumento, abertura (mm), filtro ou projeção:
sheet-fill-clock = Relógio acertado por (GPS, rádio, telemóvel), o seu erro:
sheet-reduce-note-html = Para <code>reduce</code>, copie cada linha para um ficheiro de observações (<code>transit-parallax template observations</code>): contact, time_utc (ou a hora do relógio com o seu desvio, 2032-11-13T07:43:40.5+01:00), sigma_s (a sua certeza) e observer.

## O rodapé

sheet-calendar-empty = Nenhum dos contactos se vê daqui com o Sol acima do horizonte, por isso o calendário { $file } não tem eventos.
sheet-calendar-holds =
    O calendário { $file } tem { $n ->
        [one] o contacto visto
       *[other] os { $n } contactos vistos
    } com o Sol acima do horizonte, com lembretes.
sheet-computed = Calculado por transit-parallax { $version } com a efeméride { $ephemeris }; Delta T { $delta_t } s.

## Delta T

sheet-delta-t-fixed-value = { $value }, fixo
sheet-delta-t-fixed = Delta T fixado com --delta-t.
sheet-delta-t-from = Delta T segundo { $source }.
sheet-delta-t-source-leap-seconds = a tabela de segundos intercalares e o DUT1 dado
sheet-delta-t-source-reconstruction = a reconstrução de Morrison, Stephenson, Hohenkerk e Zawilski (2021)
sheet-delta-t-source-observed = as observações do IERS
sheet-delta-t-source-predicted = as previsões do Boletim A do IERS
sheet-delta-t-source-extrapolated = uma extrapolação: o valor central de três previsões publicadas, com metade da sua dispersão como incerteza
sheet-times-utc-hardly = As horas estão em UTC; a incerteza de Delta T quase não move os contactos.
sheet-times-ut1 = As horas estão em UT1, que é TT - Delta T: um erro em Delta T move cada hora impressa em cerca do mesmo valor.
sheet-times-utc = As horas estão em UTC.
sheet-times-utc-held = As horas estão em UTC com TAI - UTC mantido no seu último valor, de modo que ficam ligadas a TT: um erro em Delta T só as move pela rotação da Terra sob o evento (segundos por minutos de Delta T), enquanto o UT1 de cada contacto, e qualquer segundo intercalar ainda por vir, se moveria o erro inteiro.

## O calendário (.ics)

calendar-summary =
    { $planet ->
        [venus] Trânsito de Vénus
       *[other] Trânsito de Mercúrio
    }: contacto { $contact } ({ $station })
calendar-clock-time = Hora do relógio { $time } ({ $abbreviation }).
calendar-description =
    Contacto { $contact } do trânsito de { $planet ->
        [venus] Vénus
       *[other] Mercúrio
    } em { $station }: { $clock }UTC { $utc }. Altura do Sol { $altitude } graus, ângulo de posição { $position_angle }, ângulo de vértice { $vertex_angle }.
calendar-reminder =
    Contacto { $contact } do trânsito de { $planet ->
        [venus] Vénus
       *[other] Mercúrio
    } dentro de { $n } minutos
