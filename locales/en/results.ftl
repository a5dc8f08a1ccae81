# transit-parallax: results messages in English (the reference: every message here must exist in every language's file, with the same variables).

## The public results page (/results)

results-title = Results: the solar parallax so far
results-not-determined = The solar parallax and the astronomical unit are not determined yet: { $why }.
results-no-timing-reduced = no timing has been reduced yet
results-no-timings-arrived = no timings have arrived yet
results-first-being-computed = the first solution is being computed
results-parallax = solar parallax
results-au = astronomical unit
results-timings-used = timings used
results-used-of = { $used } of { $total }
results-au-value = { $au } ± { $sigma } million km (95 %: { $lo } to { $hi } million km)
results-au-value-open = { $au } ± { $sigma } million km (95 %: from { $lo } million km, unbounded above)
results-au-not-given = not given: the parallax's one-sigma range reaches zero, so the timings set no upper bound on it
results-parallax-not-determined = The solar parallax is not determined yet, and so neither is the astronomical unit: { $why }.
results-default-why = the timings in force do not determine it
results-need-two-none = Timings from at least two stations far apart are needed; no station has sent usable ones yet.
results-need-two-one = Timings from at least two stations far apart are needed; one station has sent usable ones so far.
# $stations, $timings and $submissions arrive as HTML (a bold number each).
results-counts = Stations: { $stations }; timings in force: { $timings }; submissions: { $submissions }.
results-stations-heading = The stations
results-map-caption = The stations, each at its place rounded to 0.1 degree.
results-col-station = station
results-col-latitude = latitude (0.1°)
results-col-longitude = longitude (0.1°)
results-col-timings = timings used
results-col-share = share of the information
results-share-not-determined = not determined
results-share-none = none
results-convergence-heading = How the solution converged
results-convergence-caption = The solar parallax and its uncertainty as the timings are added.
results-convergence-older = Drawn for an earlier version of the data ({ $version }); the newest is being drawn.
# HTML: two links.
results-links = <a href="/register">Register a station</a> · <a href="/">Send your timings</a>

## The "as of" sentence (results page and organiser's page)

as-of-none = No solution has been computed yet
as-of-solution = Solution as of { $when } UTC (version { $version } of the data)
as-of-settled = { $solution }; it includes every timing received.
as-of-pending = { $solution }; { $n ->
    [one] 1 newer change (a submission, correction or exclusion) is being reduced.
   *[other] { $n } newer changes (submissions, corrections or exclusions) are being reduced.
  }

## The charts of the results page

chart-map-title = World map of the stations
chart-map-not-used = { $station } (#{ $number }): not used: { $why }
chart-map-station = { $station } (#{ $number }): share { $share }, mean z { $z }
chart-map-colour-key = colour: mean (O - C)/σ
chart-map-area-key = area: share of the information
chart-convergence-title = Convergence of the solar parallax
chart-convergence-too-few = Too few timings to follow the solution as they are added.
chart-convergence-timings-axis = timings in the solution (in the order of the file)
chart-convergence-zoomed = Solar parallax (arcsec), zoomed on the final value ± { $sigmas } uncertainties
chart-convergence-iau = IAU 2009 value { $value }"
chart-convergence-off-above = { $label } above, off this scale
chart-convergence-off-below = { $label } below, off this scale
chart-convergence-sigma-axis = Its standard uncertainty (arcsec, logarithmic scale)
chart-convergence-point = { $timings } timings: { $parallax }" ± { $sigma }"
chart-convergence-dashed = dashed: falling as 1/√N to the final value
