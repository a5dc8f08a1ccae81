# transit-parallax: sheet messages in English (the reference: every message here must exist in every language's file, with the same variables).
# The observers' sheet (`predict --sheets`, the service's sheet of a registered station) and its calendar.
# Messages whose id ends in -html are HTML, written as they stand (keep their tags and
# entities; the code escapes their variables, or gives HTML it made itself where said); every
# other message is plain text, escaped where it is written.
# Variables: $planet is venus or mercury (each language chooses its own words for the
# transit); $n is a count (it chooses the plural form); numbers and dates come in already
# written for the language; times of day stay 24-hour (07:43:40).
# The solar caution is the pages' own message, solar-caution (pages.ftl).

## The heading

sheet-title =
    { $planet ->
        [venus] Transit of Venus
       *[other] Transit of Mercury
    }, { $date }: { $station }
sheet-station-html = Station: <b>{ $station }</b>, latitude { $latitude }°, longitude { $longitude }° (east positive), elevation { $elevation } m.
sheet-zone-html = Clock times are in <b>{ $zone }</b>: { $abbreviation } (UTC{ $offset }) during the transit; UTC is given beside them.
sheet-no-zone-html = No time zone was given for this station, so the times are in <b>UTC only</b>. To have them in your clock time, run <code>predict</code> again with <code>--time-zone ZONE</code> (e.g. <code>Europe/Amsterdam</code> or <code>+05:30</code>) or add a <code>time_zone</code> column to the stations file.

## The four contacts

sheet-contacts-heading = The four contacts
sheet-col-contact = Contact
sheet-col-your-clock = Your clock
sheet-col-sun-altitude = Sun altitude
sheet-col-sun-azimuth = Sun azimuth
sheet-col-position-angle = Position angle
sheet-col-vertex-angle = Vertex angle
sheet-col-seen = Seen?
sheet-no-such-contact = no such contact at this station (grazing transit)
sheet-seen-yes = yes, Sun up
sheet-seen-no = below horizon — not seen
sheet-contacts-note = Times are rounded to the second. They are the ideal geometric contacts (I, II: ingress outer and inner; III, IV: egress inner and outer), predicted to ±{ $sigma } s from the ephemeris, with Delta T { $delta_t } s (see the foot of the page); what you see may differ by several seconds (the black drop, seeing, your clock). Altitude: true altitude of the Sun's centre (no refraction); azimuth from north through east. Seen: the Sun's upper limb above the horizon (true altitude above −0°50′).

## Sunrise and sunset ($time is HTML: the clock time and UTC)

sheet-sun-heading = Sunrise and sunset:
sheet-sun-up-throughout = The Sun stays up through the whole transit.
sheet-sun-down-throughout = The Sun is down for the whole transit: nothing of it can be seen from here.
sheet-sun-rises-html = The Sun rises during the transit, at { $time }.
sheet-sun-sets-html = The Sun sets during the transit, at { $time }.
sheet-sun-note = (upper limb on the horizon, standard altitude −0°50′, Meeus ch. 15; the station's height not allowed for)

## Where on the Sun's edge to look (the two drawings of the disc)

sheet-drawings-heading = Where on the Sun's edge to look
sheet-zenith-caption-1 = In the sky: zenith up
sheet-zenith-caption-2 = (vertex angle)
sheet-north-caption-1 = Equatorial mount: north up,
sheet-north-caption-2 = east left (position angle)
sheet-drawings-note = Position angle is counted from the north point of the disc through east, vertex angle from the point nearest the zenith through east; both anticlockwise here, as the sky is seen directly. A star diagonal mirrors the image and a projection screen may mirror or turn it: check which way the Sun drifts before the transit.
limb-zenith-label = Solar disc as seen in the sky, zenith up
limb-north-label = Solar disc north up, east left
# The labels drawn on the disc: keep them short (one word, or one letter for north and east).
limb-zenith = Zenith
limb-north = N
limb-east = E

## The blank table for the timings

sheet-timings-heading = Your timings
sheet-col-clock-time = Clock time (hh:mm:ss.s)
sheet-col-zone = Zone or offset
sheet-col-sure-html = Sure to&nbsp;±&nbsp;s
sheet-col-observer = Observer
sheet-col-what-seen = What you saw (black drop, cloud)
sheet-fill-observers = Observer(s):
sheet-fill-instrument = Instrument, aperture (mm), filter or projection:
sheet-fill-clock = Clock set by (GPS, radio, phone), its error:
# The column names and the example time are those of the observations file: keep them as they are.
sheet-reduce-note-html = For <code>reduce</code>, copy each row into an observations file (<code>transit-parallax template observations</code>): contact, time_utc (or the clock time with its offset, 2032-11-13T07:43:40.5+01:00), sigma_s (how sure) and observer.

## The foot of the page

sheet-calendar-empty = None of the contacts is seen from here with the Sun up, so the calendar { $file } holds no events.
sheet-calendar-holds =
    The calendar { $file } holds { $n ->
        [one] the contact
       *[other] the { $n } contacts
    } seen with the Sun up, with reminders.
sheet-computed = Computed by transit-parallax { $version } with the { $ephemeris } ephemeris; Delta T { $delta_t } s.

## Delta T: its value, where it came from, what it does to the times

sheet-delta-t-fixed-value = { $value }, fixed
sheet-delta-t-fixed = Delta T fixed by --delta-t.
sheet-delta-t-from = Delta T from { $source }.
sheet-delta-t-source-leap-seconds = the leap-second table and the DUT1 given
sheet-delta-t-source-reconstruction = the reconstruction of Morrison, Stephenson, Hohenkerk and Zawilski (2021)
sheet-delta-t-source-observed = IERS observations
sheet-delta-t-source-predicted = IERS Bulletin A predictions
sheet-delta-t-source-extrapolated = an extrapolation: the middle of three published predictions, half their spread as the uncertainty
sheet-times-utc-hardly = Times are UTC; the uncertainty of Delta T hardly moves the contacts.
sheet-times-ut1 = Times are UT1, which is TT - Delta T: an error in Delta T moves every time printed by about as much.
sheet-times-utc = Times are UTC.
sheet-times-utc-held = Times are UTC with TAI - UTC held at its last value, so they stay tied to TT: an error in Delta T moves them only through the Earth's rotation under the event (seconds for minutes of Delta T), while the UT1 of each contact, and any leap second still to come, would move by the whole error.

## The calendar (.ics): each contact's event, its description and its reminder

calendar-summary =
    { $planet ->
        [venus] Transit of Venus
       *[other] Transit of Mercury
    }: contact { $contact } ({ $station })
calendar-clock-time = Clock time { $time } ({ $abbreviation }).
# $clock is calendar-clock-time followed by a space, or nothing when the station has no zone.
calendar-description =
    Contact { $contact } of the transit of { $planet ->
        [venus] Venus
       *[other] Mercury
    } at { $station }: { $clock }UTC { $utc }. Sun's altitude { $altitude } degrees, position angle { $position_angle }, vertex angle { $vertex_angle }.
calendar-reminder =
    Contact { $contact } of the transit of { $planet ->
        [venus] Venus
       *[other] Mercury
    } in { $n } minutes
