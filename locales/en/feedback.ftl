# transit-parallax: feedback messages in English (the reference: every message here must exist in every language's file, with the same variables).
# Values: $n, $days are counts (they choose the plural form); $late, $subtract are "yes" or
# "no"; $diff, $blunder, $cause and $all are sentences of their own; other numbers arrive
# written for the language.

## A difference from a timed interval's prediction

later-than-predicted-interval = { $size } longer than the predicted interval
earlier-than-predicted-interval = { $size } shorter than the predicted interval

## What a timing's difference means

feedback-fits = { $diff }: within what your timing's uncertainty allows
feedback-probably = { $diff }: probably { $blunder }
feedback-more-than-stated = { $diff }: more than your stated uncertainty ({ $sigma } s) allows
feedback-far-off = { $diff }: far more than any error of the prediction or of a clock
feedback-outside-years = the time lies outside the years the tool covers
feedback-contact-not-seen = your station does not see contact { $contact } of this transit (the planet's path as seen from there misses that circle)
feedback-interval-not-seen = your station does not see the interval { $interval } of this transit
feedback-sun-down = the Sun was { $degrees } degrees below the horizon at your station at this contact
feedback-part-of-offset = { $diff }: part of the offset that all your timings share, probably { $cause } (said once, above); without it this timing is { $rest } s from its prediction
feedback-submission-unread = the submission could not be read as timings
feedback-row-unread = the row cannot be read
unread-time-quoted = the time '{ $time }' could not be read as a date and time
unread-time = a time could not be read as a date and time

## The blunders of one timing (the reduction's own findings)

blunder-date-off = the timing is { $oc } s from its prediction, one day within { $miss } s: the date is probably off by one day ({ $late ->
    [yes] a day late
   *[no] a day early
  })
blunder-half-day = the difference is { $hours } h, half a day: civil and astronomical day reckoning were probably confused (an astronomical day begins at noon: astronomical June 3, 21 h is civil June 4, 9 h; set day_reckoning to { $late ->
    [yes] civil if the rows say astronomical
   *[no] astronomical if the rows say civil
  }), or a.m. and p.m. on a modern clock
blunder-zone-hours = the difference is { $hours } h, a whole number of hours: local (zone) time was probably given as UTC; { $subtract ->
    [yes] subtract
   *[no] add
  } { $fix } h to correct it
blunder-half-hour-zone = the difference is { $hours } h, a whole number of half hours: a half-hour time zone was probably left in; { $subtract ->
    [yes] subtract
   *[no] add
  } { $fix } h to correct it
blunder-contacts-exchanged = labelled contact { $labelled } but fits contact { $fits } at this station (difference { $oc } s): contacts { $first } and { $second } were probably exchanged
blunder-minute-typo = the difference is { $oc } s, { $n ->
    [one] { $n } whole minute
   *[other] { $n } whole minutes
  } within { $miss } s: a digit of the minutes was probably mistyped; { $subtract ->
    [yes] subtract
   *[no] add
  } { $n } min to correct it

## An offset that all of a station's timings share

offset-cause-date = a date off by { $n ->
    [one] { $n } day
   *[other] { $n } days
  }
offset-cause-zone = a time zone of { $hours } h left in
offset-cause-clock = a clock off by about { $seconds } s
all-your-timings = { $n ->
    [2] both of your timings
    [3] all three of your timings
    [4] all four of your timings
    [5] all five of your timings
    [6] all six of your timings
    [7] all seven of your timings
    [8] all eight of your timings
   *[other] all { $n } of your timings
  }
station-advice-date = { $all } are about { $days ->
    [one] { $days } day
   *[other] { $days } days
  } { $late ->
    [yes] late
   *[no] early
  }: the date is probably wrong; check the date you wrote and send them again
station-advice-zone = { $all } are about { $hours } h { $late ->
    [yes] late: your clock's time zone was probably left in (local time given as UTC); subtract { $hours } h from
   *[no] early: your clock's time zone was probably left in (local time given as UTC); add { $hours } h to
  } each and send them again
station-advice-clock = { $all } are about { $seconds } s { $late ->
    [yes] late: check the clock you timed with (set it by a time signal or GPS); if it was off by that much, subtract { $seconds } s from
   *[no] early: check the clock you timed with (set it by a time signal or GPS); if it was off by that much, add { $seconds } s to
  } each and send them again

## What to do

advice-check-date = check the date
advice-check-contact-and-place = check the contact's number and your station's coordinates (south latitudes and west longitudes are negative)
advice-check-place-and-date = check your station's coordinates (west longitudes are negative) and the date
advice-check-pair = check the pair of contacts and your station's coordinates
advice-doubtful = check the clock you timed with and the contact's number; if the time is right as written, leave it: the solution weighs it with the others
advice-slip = correct the time as said, then send it again through your private link below
advice-does-not-fit = check the date, the time zone (give the time in UTC) and the contact's number
advice-see-station = see what to change for the whole station, above
advice-write-utc = write the date and the time of day in UTC, like { $example }
advice-correct-row = correct the row and send it again (times in UTC, like { $example })
