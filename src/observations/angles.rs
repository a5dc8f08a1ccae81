//! Latitudes and longitudes as records write them: decimal degrees, degrees-minutes-seconds
//! with a hemisphere letter (`17°29'15"S`, `149 32 30 W`, `149°32.5'W`), longitudes in hours
//! of time (`9h58m10sW`), and longitudes counted from another prime meridian than
//! Greenwich (Paris, Ferro, or any meridian given by its own longitude).
//!
//! References: sexagesimal angles and 15 degrees to the hour of time are common practice (no
//! single source); the prime meridians are cited beside their constants.

/// Which coordinate an angle is: it decides the hemisphere letters, the range and whether
/// hours of time are allowed.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Axis {
    /// Latitude: N or S, -90 to 90 degrees.
    Latitude,
    /// Longitude: E or W (east positive), -180 to 360 degrees, or hours of time.
    Longitude,
}

impl Axis {
    fn letters(self) -> (char, char) {
        match self {
            Axis::Latitude => ('N', 'S'),
            Axis::Longitude => ('E', 'W'),
        }
    }

    fn name(self) -> &'static str {
        match self {
            Axis::Latitude => "latitude",
            Axis::Longitude => "longitude",
        }
    }
}

/// The Paris Observatory meridian east of Greenwich, degrees: 2°20'14.025", the value the
/// French national mapping service gives to the Paris meridian (EPSG geodetic parameter
/// dataset, prime meridian 8903 "Paris", 2.5969213 grads; the grads converted exactly).
pub const PARIS_EAST_OF_GREENWICH_DEG: f64 = 2.596_921_3 * 0.9;

/// The Ferro (El Hierro) meridian of the French convention of 1634 (Louis XIII's ordinance,
/// kept by 18th-century French astronomy): exactly 20 degrees west of Paris, so 17°39'45.975"
/// west of Greenwich (common practice; the later Austro-Hungarian convention put it at
/// 17°40'00" west of Greenwich, EPSG prime meridian 8909, 14" further west).
pub const FERRO_EAST_OF_GREENWICH_DEG: f64 = PARIS_EAST_OF_GREENWICH_DEG - 20.0;

/// The prime meridian a longitude is counted from.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub enum Meridian {
    /// Greenwich (the default).
    #[default]
    Greenwich,
    /// The Paris Observatory.
    Paris,
    /// Ferro, 20 degrees west of Paris.
    Ferro,
    /// A meridian given by its longitude east of Greenwich, degrees.
    EastOfGreenwich(f64),
}

impl Meridian {
    /// Parse `greenwich`, `paris`, `ferro` (any case; empty is Greenwich) or that meridian's
    /// longitude east of Greenwich in any form of [`parse_angle`] (`2.3372`, `2°20'14"E`).
    pub fn parse(text: &str) -> Result<Meridian, String> {
        if text.trim().is_empty() {
            return Ok(Meridian::Greenwich);
        }
        Meridian::named(text).map_or_else(
            || {
                parse_angle(text, Axis::Longitude)
                    .map(Meridian::EastOfGreenwich)
                    .map_err(|_| {
                        format!("'{}' is not a prime meridian; write greenwich, paris, ferro, or that meridian's longitude east of Greenwich in degrees (2.3372 for Paris)", text.trim())
                    })
            },
            Ok,
        )
    }

    /// A meridian written by name: `greenwich`, `paris`, `ferro` (also `hierro`, `el hierro`),
    /// in any case.
    pub fn named(text: &str) -> Option<Meridian> {
        match text.trim().to_ascii_lowercase().as_str() {
            "greenwich" => Some(Meridian::Greenwich),
            "paris" => Some(Meridian::Paris),
            "ferro" | "hierro" | "el hierro" => Some(Meridian::Ferro),
            _ => None,
        }
    }

    /// The meridian's longitude east of Greenwich, degrees.
    pub fn east_of_greenwich_deg(self) -> f64 {
        match self {
            Meridian::Greenwich => 0.0,
            Meridian::Paris => PARIS_EAST_OF_GREENWICH_DEG,
            Meridian::Ferro => FERRO_EAST_OF_GREENWICH_DEG,
            Meridian::EastOfGreenwich(d) => d,
        }
    }
}

/// The sentence for a text that is not an angle of this axis.
fn not_an_angle(text: &str, axis: Axis) -> String {
    let time = if axis == Axis::Longitude {
        " or hours of time (9h58m10sW)"
    } else {
        ""
    };
    format!(
        "'{}' is not a {}; write decimal degrees (-17.4875), degrees, minutes and seconds with the hemisphere (17°29'15\"S, 17 29 15 S){time}",
        text.trim(),
        axis.name()
    )
}

/// A hemisphere letter at the start or the end of a coordinate, and the text without it. A
/// trailing `s` after a digit is the seconds mark, not south, when the text writes its units
/// as letters (`9h58m10s`, `149d32m30s`).
fn hemisphere_letter(text: &str) -> (Option<char>, &str) {
    let t = text.trim();
    let letter_units = t
        .chars()
        .any(|c| matches!(c, 'h' | 'H' | 'd' | 'D' | 'm' | 'M'));
    let mut chars = t.chars();
    if let (Some(last), Some(before)) = (chars.next_back(), chars.next_back()) {
        let up = last.to_ascii_uppercase();
        let seconds_mark = up == 'S' && before.is_ascii_digit() && letter_units;
        if matches!(up, 'N' | 'S' | 'E' | 'W') && !seconds_mark {
            return (Some(up), t[..t.len() - last.len_utf8()].trim_end());
        }
    }
    match t.chars().next() {
        Some(first) if matches!(first.to_ascii_uppercase(), 'N' | 'S' | 'E' | 'W') => (
            Some(first.to_ascii_uppercase()),
            t[first.len_utf8()..].trim_start(),
        ),
        _ => (None, t),
    }
}

/// The hemisphere's sign from a letter at either end, whether there was one, and the text
/// without it.
fn hemisphere(text: &str, axis: Axis) -> Result<(f64, bool, &str), String> {
    let (pos, neg) = axis.letters();
    match hemisphere_letter(text) {
        (None, body) => Ok((1.0, false, body)),
        (Some(c), body) if c == pos => Ok((1.0, true, body)),
        (Some(c), body) if c == neg => Ok((-1.0, true, body)),
        (Some(c), _) => Err(format!(
            "'{}' is a {} but carries the letter {c}; write {pos} or {neg}",
            text.trim(),
            axis.name()
        )),
    }
}

/// Split a sexagesimal text into its numbers and their unit marks: `17°29'15"` gives
/// [(17, '°'), (29, '\''), (15, '"')]; `149 32 30` gives the marks ' '.
fn components(text: &str) -> Option<Vec<(f64, char)>> {
    let mut out = Vec::new();
    let mut number = String::new();
    for c in text.chars() {
        if c.is_ascii_digit() || c == '.' {
            number.push(c);
            continue;
        }
        let mark = match c {
            '°' | 'd' | 'D' | 'º' => '°',
            '\'' | '′' | 'm' | 'M' | '’' => '\'',
            '"' | '″' | 's' | 'S' | '”' => '"',
            'h' | 'H' => 'h',
            ' ' | ':' => ' ',
            _ => return None,
        };
        if !number.is_empty() {
            out.push((number.parse().ok()?, mark));
            number.clear();
        } else if mark != ' ' {
            return None;
        }
    }
    if !number.is_empty() {
        out.push((number.parse().ok()?, ' '));
    }
    Some(out)
}

/// Parse a latitude or a longitude (degrees; north and east positive) from decimal degrees,
/// degrees-minutes-seconds with an optional hemisphere letter, or, for a longitude, hours,
/// minutes and seconds of time (`9h58m10sW`: 15 degrees to the hour). The value is checked
/// against the axis's range (latitude -90 to 90, longitude -180 to 360).
///
/// Errors: a sentence naming what is wrong and how to write it.
pub fn parse_angle(text: &str, axis: Axis) -> Result<f64, String> {
    let (hemi, lettered, body) = hemisphere(text, axis)?;
    let (sign, body) = match body.strip_prefix('-') {
        Some(_) if lettered => {
            return Err(format!(
                "'{}' has both a minus sign and a hemisphere letter; give one of them",
                text.trim()
            ))
        }
        Some(rest) => (-1.0, rest.trim()),
        None => (1.0, body.strip_prefix('+').unwrap_or(body).trim()),
    };
    let parts = components(body).ok_or_else(|| not_an_angle(text, axis))?;
    let hours = parts.first().is_some_and(|p| p.1 == 'h');
    if hours && axis == Axis::Latitude {
        return Err(format!(
            "'{}' is in hours of time, which only a longitude can be; write the latitude in degrees",
            text.trim()
        ));
    }
    let first_mark = if hours { 'h' } else { '°' };
    let in_order = parts
        .iter()
        .zip([first_mark, '\'', '"'])
        .all(|(p, expected)| p.1 == ' ' || p.1 == expected);
    if parts.is_empty() || parts.len() > 3 || !in_order {
        return Err(not_an_angle(text, axis));
    }
    for (k, (value, _)) in parts.iter().enumerate().skip(1) {
        if *value >= 60.0 {
            return Err(format!(
                "'{}' has {value} {}; minutes and seconds must be under 60",
                text.trim(),
                if k == 1 { "minutes" } else { "seconds" }
            ));
        }
    }
    if parts.len() > 1 && parts[..parts.len() - 1].iter().any(|p| p.0.fract() != 0.0) {
        return Err(format!(
            "'{}' has a fraction before its last part; only the last of degrees, minutes and seconds may carry decimals",
            text.trim()
        ));
    }
    let magnitude = parts
        .iter()
        .zip([1.0, 60.0, 3600.0])
        .map(|((v, _), d)| v / d)
        .sum::<f64>()
        * if hours { 15.0 } else { 1.0 };
    let value = hemi * sign * magnitude;
    let (min, max) = match axis {
        Axis::Latitude => (-90.0, 90.0),
        Axis::Longitude => (-180.0, 360.0),
    };
    if !value.is_finite() || value < min || value > max {
        return Err(format!(
            "the {} '{}' is outside {min} to {max} degrees; check the value",
            axis.name(),
            text.trim()
        ));
    }
    Ok(value)
}

/// Whole units, minutes and seconds (to 0.1) of a non-negative value, the seconds rounded
/// first so that they never read 60.
fn three_parts(v: f64) -> (u64, u64, f64) {
    let tenths = (v * 36_000.0).round() as u64;
    let (whole, rest) = (tenths / 36_000, tenths % 36_000);
    (whole, rest / 600, (rest % 600) as f64 / 10.0)
}

/// An angle written as records wrote it: degrees, minutes and seconds (to 0.1") with the
/// hemisphere letter (`17°29'15.0"S`); [`parse_angle`] reads it back.
pub fn format_sexagesimal(value_deg: f64, axis: Axis) -> String {
    let (pos, neg) = axis.letters();
    let (d, m, s) = three_parts(value_deg.abs());
    let letter = if value_deg < 0.0 { neg } else { pos };
    format!("{d}°{m:02}'{s:04.1}\"{letter}")
}

/// A longitude written in hours, minutes and seconds of time (to 0.1 s) with E or W
/// (`9h58m10.0sW`); [`parse_angle`] reads it back.
pub fn format_hours_of_time(longitude_deg: f64) -> String {
    let (h, m, s) = three_parts(longitude_deg.abs() / 15.0);
    let letter = if longitude_deg < 0.0 { 'W' } else { 'E' };
    format!("{h}h{m:02}m{s:04.1}s{letter}")
}

#[cfg(test)]
mod tests {
    use super::*;

    fn close(a: f64, b: f64) -> bool {
        (a - b).abs() < 1e-9
    }

    #[test]
    fn every_written_form_is_read() {
        // Fort Venus, Tahiti, as Green and Cook printed it (Phil. Trans. 61, 1771): latitude
        // 17°29'15" S, longitude 9h58m10s = 149°32'30" west of Greenwich.
        let lat = -(17.0 + 29.0 / 60.0 + 15.0 / 3600.0);
        let lon = -(149.0 + 32.0 / 60.0 + 30.0 / 3600.0);
        for t in [
            "17°29'15\"S",
            "17 29 15 S",
            "S 17°29′15″",
            "-17:29:15",
            "-17.4875",
        ] {
            assert!(close(parse_angle(t, Axis::Latitude).unwrap(), lat), "{t}");
        }
        for t in [
            "149°32'30\"W",
            "149 32 30 W",
            "149°32.5'W",
            "9h58m10sW",
            "9h 58m 10s W",
            "-149.541666666667",
            "W 149d32m30s",
        ] {
            assert!(
                (parse_angle(t, Axis::Longitude).unwrap() - lon).abs() < 1e-9,
                "{t}"
            );
        }
        assert!(close(parse_angle("210.5", Axis::Longitude).unwrap(), 210.5));
        assert!(close(parse_angle("17.5S", Axis::Latitude).unwrap(), -17.5));
        assert!(close(
            parse_angle("17d29m15sS", Axis::Latitude).unwrap(),
            lat
        ));
        assert!(close(
            parse_angle("9h58m10s", Axis::Longitude).unwrap(),
            -lon
        ));
    }

    #[test]
    fn written_forms_read_back() {
        for v in [-17.487_5f64, 149.541_666, -0.0001, 59.999_99, 0.0] {
            let axis = if v.abs() < 90.0 {
                Axis::Latitude
            } else {
                Axis::Longitude
            };
            let text = format_sexagesimal(v, axis);
            assert!(
                (parse_angle(&text, axis).unwrap() - v).abs() < 0.1 / 3600.0,
                "{text}"
            );
            let text = format_hours_of_time(v);
            let back = parse_angle(&text, Axis::Longitude).unwrap();
            assert!((back - v).abs() < 1.5 / 3600.0 * 15.0 / 10.0, "{text}");
        }
        assert_eq!(
            format_sexagesimal(-17.4875, Axis::Latitude),
            "17°29'15.0\"S"
        );
        assert_eq!(format_hours_of_time(-149.541_666_7), "9h58m10.0sW");
    }

    #[test]
    fn bad_forms_say_how_to_write_them() {
        let bad = [
            ("17°75'S", Axis::Latitude, "under 60"),
            ("17°29'75\"S", Axis::Latitude, "under 60"),
            ("149 32 30 N", Axis::Longitude, "write E or W"),
            ("17 29 15 E", Axis::Latitude, "write N or S"),
            ("-17 29 15 S", Axis::Latitude, "minus sign"),
            ("9h58m10s", Axis::Latitude, "hours of time"),
            ("95 0 0 N", Axis::Latitude, "outside"),
            ("seventeen", Axis::Latitude, "decimal degrees"),
            ("17.5°29'", Axis::Latitude, "fraction"),
            ("", Axis::Longitude, "hours of time"),
            ("29'17°", Axis::Latitude, "decimal degrees"),
        ];
        for (text, axis, needle) in bad {
            let e = parse_angle(text, axis).unwrap_err();
            assert!(e.contains(needle), "{text}: {e}");
        }
    }

    #[test]
    fn meridians_are_counted_from_greenwich() {
        // EPSG prime meridian 8903 (Paris): 2.5969213 grads = 2°20'14.025" east.
        let paris = 2.0 + 20.0 / 60.0 + 14.025 / 3600.0;
        assert!((PARIS_EAST_OF_GREENWICH_DEG - paris).abs() < 1e-8);
        assert_eq!(Meridian::parse("Paris"), Ok(Meridian::Paris));
        assert!((Meridian::Ferro.east_of_greenwich_deg() + 17.662_770_8).abs() < 1e-6);
        assert_eq!(Meridian::parse(""), Ok(Meridian::Greenwich));
        assert_eq!(
            Meridian::parse("2.3372"),
            Ok(Meridian::EastOfGreenwich(2.3372))
        );
        assert!(Meridian::parse("atlantis").unwrap_err().contains("paris"));
    }
}
