# transit-parallax: the participants' pages in English (the reference for every other
# language: each message here must exist in every file, with the same variables).
# Variables: $n is a count (it chooses the plural form); every other value comes in as text,
# numbers already written for the language.

## The frame of every page

skip-link = Skip to the content
site-line = pooled timings
solar-caution = CAUTION: looking at the Sun can blind. Never look at the Sun, even briefly or partly covered, without a certified solar filter on the front of the telescope or eye, or watch its image projected on a screen. Never look through an optical finder: cap it or take it off. Follow local guidance, the rules of your site and the directions of an experienced supervisor.
footer-line = transit-parallax { $version }: contact timings pooled for the solar parallax. These pages load nothing from elsewhere and run no script.
language-switch = Language
back-to-form = Back to the form

## The participant's form

form-title = Send your timings
form-intro = Send the contact times you observed of the transit of { $planet ->
        [venus] Venus
       *[other] Mercury
    } of { $date }. You will see at once how each compares with its prediction at your station.
form-before-and-after = Before the event, <a href="/register">register your station</a> for its observers' sheet and calendar; <a href="/results">the results so far</a> are public.
station-heading = Your station
station-name = Station's name
station-name-hint = as you want it listed
latitude = Latitude (degrees)
latitude-hint = north positive, south negative: { $example }
longitude = Longitude (degrees)
longitude-hint = east positive, west negative: { $example }
elevation = Elevation (metres)
elevation-hint = above sea level
longitude-sigma = Longitude's uncertainty (degrees)
longitude-sigma-hint = or the word unknown; leave empty when the longitude is exact
timings-heading = Your timings
timings-note = One block per contact you timed; leave the others on "not timed".
timing-legend = Timing { $number }
contact = Contact
contact-none = not timed
contact-1 = I: exterior ingress (first touch)
contact-2 = II: interior ingress (fully on the Sun)
contact-3 = III: interior egress (begins to leave)
contact-4 = IV: exterior egress (last touch)
time-utc = Time (UTC)
time-utc-hint = date and time with Z: { $example }
sigma = Uncertainty (seconds)
sigma-hint = how sure you are of the time; empty: the usual for that contact
local-summary = Timed by local solar time (an old record)?
time-local = Local solar time
time-local-hint = instead of UTC, no zone: { $example }
local-kind = Kind of local time
local-kind-none = none (the time is UTC)
local-kind-apparent = apparent (sundial time)
local-kind-mean = mean (local mean time)
day-reckoning = Day reckoning
day-civil = civil (from midnight)
day-astronomical = astronomical (from noon)
as-sent = as sent: { $value }
send-timings = Send these timings
paste-legend = Or paste an observations file
paste-label = Observations (CSV)
paste-hint = with the columns { $columns }
send-paste = Send the pasted file
upload-legend = Or send an observations file
upload-label = File
upload-hint = CSV with the columns above, or an .xlsx or .ods spreadsheet
send-file = Send the file
limits = Limits: a pasted or uploaded file may be up to { $kb } KB (about { $rows } rows); split a longer file into parts and send each. Each part is a submission of its own; the timings of one station in several parts are pooled.

## The feedback after a submission

feedback-title = Thank you: your timings
feedback-title-unread = Your timings could not be read
feedback-duplicate = This is the same as a submission already received; it was not counted twice.
feedback-received = Received and stored as submission { $id }: { $n ->
    [one] { $n } timing read.
   *[other] { $n } timings read.
  }
feedback-some-unread = { $n ->
    [one] { $n } row could not be read: see below.
   *[other] { $n } rows could not be read: see below.
  }
feedback-none-read = We kept what you sent (as submission { $id }) so that the organiser can see it, but none of its { $n ->
    [one] { $n } row
   *[other] { $n } rows
  } could be read as a timing. Below, under each row: what could not be read and what to change. Then send the timings again.
feedback-private-link = To review or correct your submission later, keep this private link:
feedback-versions = A correction is stored as a new version; the old one is kept.
send-another = Send another
all-together = All your timings together: { $station }
each-timing = Each timing
card-contact = Contact { $contact }
card-contact-none = (none given)
card-station = Station
card-your-time = Your time
card-predicted = Predicted
card-difference = Difference
card-sun-altitude = Sun's altitude
card-sun-altitude-value = { $degrees } degrees
card-verdict = Verdict
card-meaning = What it means
card-what-to-do = What to do
card-nothing-to-do = nothing: thank you
verdict-fits = fits
verdict-doubtful = doubtful
verdict-does-not-fit = does not fit
verdict-unread = could not be read
later-than-predicted = { $size } later than predicted
earlier-than-predicted = { $size } earlier than predicted
share-later = Your share of the campaign's information on the solar parallax will show once at least { $min } stations have sent timings ({ $so_far } so far): the parallax is measured by comparing stations.
share-none = These timings carry no information on the parallax yet (none of them could be used).
share-value = Your station's expected share of the campaign's information on the solar parallax so far: { $percent } % (before the planet's place and the radii are fitted).

## The review of one's own submission, and refusals

review-title = Your submission { $id }
review-correct-heading = Correct it
review-correct-note = Sending this form stores a new version; the old one is kept.
review-superseded = This version has been corrected by a later one.
not-found = Not found
not-found-submission = No submission answers to this link.
refused = Refused
refused-not-in-force = This link does not open a submission in force.
not-received = Not received
choose-a-file = Choose a file to send.
not-read = Not read
stored-as-it-came = What you sent was stored as it came, and the organiser can see it.
verdict-slip = probably a slip you can fix

## How the timings were made

how-heading = How you timed
observer = Observer
observer-hint = your name or your group's; optional
clock-source = Clock you read the time from
instrument = Instrument
instrument-hint = e.g. 80 mm refractor
aperture = Aperture (millimetres)
aperture-hint = the lens or mirror's diameter
viewing = How you viewed the Sun
notes = Notes
notes-hint = seeing, clouds, anything the organiser should know
not-said = not said
clock-gps = GPS receiver
clock-radio = radio time signal
clock-network = computer on network time
clock-phone = mobile phone
clock-other = other (a watch set by hand)
viewing-filter = certified solar filter over the front
viewing-projection = projection onto a screen

## Registering a station before the event

register-title = Register your station
register-intro = Register your station before the transit: you get at once a private link to your observers' sheet (the contacts in your own clock time, a blank table for the timings) and a calendar of the contacts for your phone. After the event, send your timings under the same station name, and the organiser sees that your station reported.
register-refused = Not registered:
register-name-hint = as you want it listed; send your timings under the same name
register-elevation-hint = above sea level; empty: 0
register-zone = Time zone of your clocks
register-zone-hint = a name such as Europe/Amsterdam, America/Sao_Paulo or Asia/Kolkata, or an offset such as +05:30
register-button = Register the station
register-privacy = Your station's name and its place rounded to a tenth of a degree may appear on the public results page; the private link is yours alone.

## A registered station's private page

registered-title = Registered: { $station }
registered-private-link-html = Your private link: <a id="private" href="{ $href }">{ $href }</a>. Keep it: it opens your sheet and calendar again, and anyone who has it can.
registered-sheet-html = <a id="sheet" href="{ $href }">Your observers' sheet</a>: a printable page with the contacts in your clock time and a table for your timings.
registered-calendar-html = <a id="calendar" href="{ $href }" download="{ $file }">Your calendar of the contacts</a> (.ics, with reminders) for a phone or a calendar program.
registered-station-heading = Your station
registered-station = { $station }: latitude { $latitude }°, longitude { $longitude }°, elevation { $elevation } m; clocks on { $zone }.
registered-contacts-heading = The contacts there
registered-contact = Contact { $contact }: { $clock } ({ $utc } UTC), { $sun }
registered-sun-up = the Sun { $degrees }° up
registered-sun-down = the Sun below the horizon: not seen
registered-no-contact = No contact of this transit occurs at this place.
registered-after-html = After the event, <a href="/">send your timings</a> under the same station name.
not-found-registration = No registration answers to this link.
