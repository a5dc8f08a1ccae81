//! Files as people make them: the embedded demonstration campaign rewritten in each form a
//! spreadsheet or a logbook gives (semicolons and decimal commas, tabs after a `sep=` line,
//! coordinates with hemisphere letters, times without a date, ISO 8601 decimal commas, .xlsx
//! and .ods workbooks written by general-purpose writer crates, blank rows) must reduce to the
//! very result of the clean comma-separated file; stations files likewise predict alike.

mod common;
use common::{err, out, run, run_words, temp};

const CLEAN: &str = include_str!("../src/data/demo_campaign.csv");

/// The clean file's rows as fields (comments and header left out).
fn rows() -> Vec<Vec<String>> {
    CLEAN
        .lines()
        .filter(|l| !l.starts_with('#') && !l.starts_with("station,") && !l.trim().is_empty())
        .map(|l| l.split(',').map(str::to_string).collect())
        .collect()
}

const HEADER: [&str; 7] = [
    "station",
    "latitude",
    "longitude",
    "elevation_m",
    "contact",
    "time_utc",
    "sigma_s",
];

/// Reduce a file (extra arguments after it) and return its JSON.
fn reduce(path: &str, extra: &[&str]) -> serde_json::Value {
    let mut args = vec!["reduce", path, "--format", "json"];
    args.extend(extra);
    let o = run(&args);
    assert!(o.status.success(), "{path}: {}", err(&o));
    serde_json::from_str(&out(&o)).expect("json")
}

/// The clean file's result, to which every form must come (a file of its own for each form:
/// the tests run at once).
fn clean(form: &str) -> serde_json::Value {
    let name = format!("forms_clean_{}.csv", form.replace(' ', "_"));
    reduce(&temp(&name, CLEAN.as_bytes()), &[])
}

fn assert_same_result(form: &str, got: &serde_json::Value) {
    let want = clean(form);
    for key in [
        "parallax_arcsec",
        "parallax_sigma_arcsec",
        "timings_used",
        "timings_total",
    ] {
        assert_eq!(got[key], want[key], "{form}: {key}");
    }
}

/// Degrees as sexagesimal with a hemisphere letter and a decimal comma: 64°50'24,0"N.
fn sexagesimal(value: &str, positive: char, negative: char) -> String {
    let v: f64 = value.parse().expect("number");
    // Whole tenths of an arcsecond first, so that no field rounds up to 60.
    let tenths = (v.abs() * 36_000.0).round() as i64;
    let (d, m, s) = (
        tenths / 36_000,
        tenths / 600 % 60,
        (tenths % 600) as f64 / 10.0,
    );
    let hemisphere = if v < 0.0 { negative } else { positive };
    format!("{d}°{m:02}'{s:04.1}\"{hemisphere}").replace('.', ",")
}

#[test]
fn semicolons_decimal_commas_and_hemisphere_letters() {
    let mut text = HEADER.join(";") + "\n";
    for r in rows() {
        let lat = sexagesimal(&r[1], 'N', 'S');
        let lon = sexagesimal(&r[2], 'E', 'W');
        let time = r[5].replace('.', ",");
        text.push_str(
            &[&r[0], &lat, &lon, &r[3], &r[4], &time, &r[6]]
                .map(|s| s.as_str())
                .join(";"),
        );
        text.push('\n');
    }
    // A spreadsheet's blank row is no timing.
    text.push_str(";;;;;;\n");
    let path = temp("forms_semicolon.csv", text.as_bytes());
    assert_same_result("semicolons", &reduce(&path, &[]));
}

#[test]
fn tabs_after_a_separator_line() {
    let mut text = format!("sep=\t\n{}\n", HEADER.join("\t"));
    for r in rows() {
        text.push_str(&r.join("\t"));
        text.push('\n');
    }
    let path = temp("forms_tabs.tsv", text.as_bytes());
    assert_same_result("tabs", &reduce(&path, &[]));
}

#[test]
fn iso_decimal_commas_in_a_comma_separated_file() {
    let mut text = HEADER.join(",") + "\n";
    for r in rows() {
        let mut f = r.clone();
        f[5] = format!("\"{}\"", r[5].replace('.', ","));
        text.push_str(&f.join(","));
        text.push('\n');
    }
    let path = temp("forms_iso_comma.csv", text.as_bytes());
    assert_same_result("ISO decimal comma", &reduce(&path, &[]));
}

#[test]
fn times_without_a_date_take_the_date_of_the_predicted_contact() {
    // The demonstration's blunders include two dates a day late, which an undated time cannot
    // carry: those rows are left out of both files compared here.
    let kept: Vec<Vec<String>> = rows()
        .into_iter()
        .filter(|r| {
            !matches!(
                (r[0].as_str(), r[4].as_str()),
                ("Red Mesa Station", "1") | ("Southern Lamp Club", "2")
            )
        })
        .collect();
    let mut clean_text = HEADER.join(",") + "\n";
    for r in &kept {
        clean_text.push_str(&r.join(","));
        clean_text.push('\n');
    }
    let want = reduce(&temp("forms_dated.csv", clean_text.as_bytes()), &[]);
    let mut text = HEADER.join(",") + "\n";
    for r in &kept {
        let mut f = r.clone();
        f[5] = r[5][11..].to_string();
        text.push_str(&f.join(","));
        text.push('\n');
    }
    let path = temp("forms_undated.csv", text.as_bytes());
    let got = reduce(&path, &["--planet", "venus", "--date", "2012-06-06"]);
    for key in [
        "parallax_arcsec",
        "parallax_sigma_arcsec",
        "timings_used",
        "timings_total",
    ] {
        assert_eq!(got[key], want[key], "undated: {key}");
    }
    let warnings = got["warnings"].to_string();
    assert!(warnings.contains("written without a date"), "{warnings}");
    assert!(warnings.contains("2012-06-05, 2012-06-06"), "{warnings}");
    // Without the event named, the file cannot say which transit it is.
    let o = run(&["reduce", &path]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("give --planet and --date"), "{}", err(&o));
}

/// The demo rows' time as a spreadsheet date-time: (y, m, d, h, min, seconds).
fn split_time(text: &str) -> (u16, u8, u8, u16, u8, f64) {
    let t = chrono::NaiveDateTime::parse_from_str(text, "%Y-%m-%dT%H:%M:%S%.fZ").expect("time");
    use chrono::{Datelike, Timelike};
    let s = f64::from(t.second()) + f64::from(t.nanosecond()) * 1e-9;
    (
        t.year() as u16,
        t.month() as u8,
        t.day() as u8,
        t.hour() as u16,
        t.minute() as u8,
        s,
    )
}

#[test]
fn an_xlsx_workbook_with_date_cells() {
    use rust_xlsxwriter::{ExcelDateTime, Format, Workbook};
    let mut book = Workbook::new();
    let sheet = book.add_worksheet();
    let format = Format::new().set_num_format("yyyy-mm-dd hh:mm:ss.0");
    for (c, h) in HEADER.iter().enumerate() {
        sheet.write_string(0, c as u16, *h).expect("header");
    }
    // Row 2 left blank, as people leave them.
    for (k, r) in rows().iter().enumerate() {
        let row = k as u32 + 2;
        sheet.write_string(row, 0, &r[0]).expect("name");
        for c in [1, 2, 3, 4, 6] {
            let v: f64 = r[c].parse().expect("number");
            sheet.write_number(row, c as u16, v).expect("number");
        }
        let (y, mo, d, h, mi, s) = split_time(&r[5]);
        let when = ExcelDateTime::from_ymd(y, mo, d)
            .and_then(|x| x.and_hms(h, mi, s))
            .expect("date");
        sheet
            .write_datetime_with_format(row, 5, &when, &format)
            .expect("time");
    }
    let path = std::env::temp_dir().join(format!("tp-forms-{}.xlsx", std::process::id()));
    book.save(&path).expect("xlsx written");
    let got = reduce(path.to_str().expect("path"), &[]);
    assert_same_result("xlsx", &got);
    // Date cells carry no zone: the reading notes say they were read as UTC.
    assert!(
        got["warnings"].to_string().contains("read as UTC"),
        "{}",
        got["warnings"]
    );
}

#[test]
fn an_ods_workbook_with_date_cells() {
    use spreadsheet_ods::{Sheet, Value, WorkBook};
    let mut book = WorkBook::new_empty();
    let mut sheet = Sheet::new("timings");
    for (c, h) in HEADER.iter().enumerate() {
        sheet.set_value(0, c as u32, *h);
    }
    for (k, r) in rows().iter().enumerate() {
        let row = k as u32 + 1;
        sheet.set_value(row, 0, r[0].as_str());
        for c in [1, 2, 3, 4, 6] {
            let v: f64 = r[c].parse().expect("number");
            sheet.set_value(row, c as u32, v);
        }
        let t =
            chrono::NaiveDateTime::parse_from_str(&r[5], "%Y-%m-%dT%H:%M:%S%.fZ").expect("time");
        sheet.set_value(row, 5, Value::DateTime(t));
    }
    book.push_sheet(sheet);
    let path = std::env::temp_dir().join(format!("tp-forms-{}.ods", std::process::id()));
    spreadsheet_ods::write_ods(&mut book, &path).expect("ods written");
    assert_same_result("ods", &reduce(path.to_str().expect("path"), &[]));
}

#[test]
fn impossible_and_missing_times_are_named() {
    let text = "station,latitude,longitude,elevation_m,contact,time_utc\n\
        A,52.16,4.49,0,1,2032-11-31T06:41:30Z\n\
        A,52.16,4.49,0,2,\n\
        A,52.16,4.49,0,3,2032-13-01T11:06:00Z\n\
        ,,,,,\n";
    let path = temp("forms_bad_times.csv", text.as_bytes());
    let o = run(&[
        "reduce",
        &path,
        "--planet",
        "mercury",
        "--date",
        "2032-11-13",
    ]);
    assert_eq!(o.status.code(), Some(2));
    let e = err(&o);
    assert!(
        e.contains("no such day: November 2032 has no day 31"),
        "{e}"
    );
    assert!(e.contains("missing time"), "{e}");
    assert!(e.contains("no such day: there is no month 13"), "{e}");
    // The blank row is not a timing: three rows, not four.
    assert!(e.contains("none of its 3 rows"), "{e}");
}

#[test]
fn a_time_to_the_minute_carries_its_rounding() {
    let mut text = HEADER.join(",") + "\n";
    let mut minute_line = 0;
    for (k, r) in rows().iter().enumerate() {
        let mut f = r.clone();
        if k == 1 {
            // "2012-06-05T22:23:54.3Z" written as an observer might: no seconds, no T.
            f[5] = format!("{} {}", &r[5][..10], &r[5][11..16]);
            minute_line = k + 2;
        }
        text.push_str(&f.join(","));
        text.push('\n');
    }
    let path = temp("forms_minute.csv", text.as_bytes());
    let got = reduce(&path, &[]);
    let warnings = got["warnings"].to_string();
    assert!(
        warnings.contains(&format!("to the minute only (line {minute_line})")),
        "{warnings}"
    );
    let o = run(&["reduce", &path, "--format", "csv"]);
    let csv = out(&o);
    let row = csv
        .lines()
        .find(|l| l.starts_with(&format!("{minute_line},")))
        .expect("the row is listed");
    // 8 s stated, with 60 s / sqrt(12) = 17.3 s of rounding in quadrature: 19.1 s (GUM 4.3.7).
    let sigma: f64 = row
        .split(',')
        .nth(6)
        .and_then(|s| s.parse().ok())
        .expect("sigma");
    assert!((sigma - (64.0f64 + 300.0).sqrt()).abs() < 0.05, "{sigma}");
}

#[test]
fn stations_in_semicolons_and_sexagesimal_predict_alike() {
    let clean = "station,latitude,longitude,elevation_m\nCanal Club,52.1601,4.4970,2\nBay School,-33.9249,18.4241,10\n";
    let local = "sep=;\nstation;latitude;longitude;elevation_m\nCanal Club;52°09'36,36\"N;4°29'49,2\"E;2\nBay School;33°55'29,64\"S;18°25'26,76\"E;10\n";
    let predict = |name: &str, text: &str| {
        let path = temp(name, text.as_bytes());
        let o = run_words(
            "predict --planet mercury --date 2032-11-13 --stations",
            &[&path, "--format", "csv"],
        );
        assert!(o.status.success(), "{name}: {}", err(&o));
        out(&o)
    };
    let a = predict("forms_stations.csv", clean);
    let b = predict("forms_stations_semi.csv", local);
    let times = |t: &str| -> Vec<String> {
        t.lines()
            .map(|l| l.split(',').take(3).collect::<Vec<_>>().join(","))
            .collect()
    };
    assert_eq!(times(&a), times(&b));
}

#[test]
fn templates_print_a_header_and_a_commented_example() {
    for kind in ["stations", "observations"] {
        let o = run(&["template", kind]);
        assert!(o.status.success(), "{kind}: {}", err(&o));
        let text = out(&o);
        assert!(
            text.lines()
                .any(|l| l.starts_with("station,latitude,longitude")),
            "{text}"
        );
        assert!(text.lines().any(|l| l.starts_with("# Example")), "{text}");
    }
    // The example, uncommented, is a valid row of its kind.
    let stations = out(&run(&["template", "stations"])).replace("\n# Example", "\nExample");
    let path = temp("forms_template_stations.csv", stations.as_bytes());
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[&path],
    );
    assert!(o.status.success(), "{}", err(&o));
    assert!(out(&o).contains("Civil time: Europe/Amsterdam for every station."));
    let o = run(&["template", "observations"]);
    assert!(
        out(&o).contains("certified solar filter"),
        "the caution is in the file"
    );
}

#[test]
fn plan_lists_every_bad_site_at_once() {
    let text = "station,latitude,longitude\nA,52,4\nB,95,4\nC,10,east\nD,-33,18\n";
    let path = temp("forms_bad_sites.csv", text.as_bytes());
    let o = run_words("plan --planet venus --date 2117-12-11 --sites", &[&path]);
    assert_eq!(o.status.code(), Some(2));
    let e = err(&o);
    assert!(e.contains("2 of its 4 rows cannot be read"), "{e}");
    assert!(e.contains("forms_bad_sites.csv:3:2"), "{e}");
    assert!(e.contains("forms_bad_sites.csv:4:3"), "{e}");
}

/// A stored ZIP archive of these entries (name, text), as an office program would write it.
fn zip_of(entries: &[(&str, &str)]) -> Vec<u8> {
    use std::io::Write;
    let mut out = std::io::Cursor::new(Vec::new());
    {
        let mut zip = zip::ZipWriter::new(&mut out);
        for (name, text) in entries {
            zip.start_file(*name, zip::write::SimpleFileOptions::default())
                .expect("entry");
            zip.write_all(text.as_bytes()).expect("write");
        }
        zip.finish().expect("zip");
    }
    out.into_inner()
}

#[test]
fn a_workbook_with_notes_above_its_header_and_a_stray_far_cell_reads_as_the_csv() {
    use rust_xlsxwriter::Workbook;
    let mut book = Workbook::new();
    let sheet = book.add_worksheet();
    sheet
        .write_string(0, 0, "# Timings of the demonstration campaign")
        .expect("note");
    for (c, h) in HEADER.iter().enumerate() {
        sheet.write_string(2, c as u16, *h).expect("header");
    }
    for (k, r) in rows().iter().enumerate() {
        for (c, v) in r.iter().enumerate() {
            sheet.write_string(k as u32 + 3, c as u16, v).expect("cell");
        }
    }
    // A stray cell in the sheet's last row and column: the reader must not build the whole
    // sheet in memory (17 billion cells) to reach it.
    sheet
        .write_string(1_048_575, 16_383, "x")
        .expect("far cell");
    // Named .csv: files are known by their content, not their name.
    let path = std::env::temp_dir().join(format!("tp-forms-far-{}.csv", std::process::id()));
    book.save(&path).expect("xlsx written");
    assert_same_result("far cell", &reduce(path.to_str().expect("path"), &[]));
}

#[test]
fn a_sheet_too_large_to_expand_and_an_old_workbook_are_refused_with_a_way_out() {
    let rows = r#"<table:table-row table:number-rows-repeated="1000000"><table:table-cell table:number-columns-repeated="7" office:value-type="float" office:value="1"/></table:table-row>"#;
    let content = format!(
        r#"<?xml version="1.0" encoding="UTF-8"?><office:document-content xmlns:office="urn:oasis:names:tc:opendocument:xmlns:office:1.0" xmlns:table="urn:oasis:names:tc:opendocument:xmlns:table:1.0" office:version="1.2"><office:body><office:spreadsheet><table:table table:name="S">{rows}</table:table></office:spreadsheet></office:body></office:document-content>"#
    );
    let bytes = zip_of(&[
        ("mimetype", "application/vnd.oasis.opendocument.spreadsheet"),
        ("content.xml", &content),
    ]);
    let path = temp("forms_repeated.ods", &bytes);
    let o = run(&["reduce", &path]);
    assert_eq!(o.status.code(), Some(2), "{}", err(&o));
    let e = err(&o);
    assert!(e.contains("too large to read"), "{e}");
    assert!(e.contains("7000000 cells"), "{e}");
    // An OLE2 compound file (.xls): refused before any reader expands it.
    let mut old = vec![0xD0, 0xCF, 0x11, 0xE0, 0xA1, 0xB1, 0x1A, 0xE1];
    old.resize(4096, 0);
    let path = temp("forms_old.xls", &old);
    let o = run(&["reduce", &path]);
    assert_eq!(o.status.code(), Some(2));
    assert!(err(&o).contains("save it as .xlsx or .ods"), "{}", err(&o));
}

#[test]
fn a_decimal_comma_in_a_comma_separated_stations_file_is_named() {
    let text = "station,latitude,longitude\nA,52,1601,4.4970\nB,48.85,2.35\n";
    let path = temp("forms_overfull.csv", text.as_bytes());
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --stations",
        &[&path],
    );
    assert_eq!(o.status.code(), Some(2));
    let e = err(&o);
    assert!(
        e.contains("forms_overfull.csv:2: the row has 4 fields but the header names 3"),
        "{e}"
    );
    assert!(e.contains("semicolons"), "{e}");
}

#[test]
fn offsets_west_of_greenwich_and_decimal_commas_before_an_offset() {
    let text = "station,latitude,longitude\nA,-22.9,-43.2\n";
    let path = temp("forms_west.csv", text.as_bytes());
    let o = run_words(
        "predict --planet mercury --date 2032-11-13 --format json --time-zone -03:00 --stations",
        &[&path],
    );
    assert!(o.status.success(), "{}", err(&o));
    assert!(out(&o).contains("-03:00"), "{}", out(&o));
    // Times written with the clock's offset and a decimal comma, semicolon-separated.
    let mut text = HEADER.join(";") + "\n";
    for r in rows() {
        let utc =
            chrono::NaiveDateTime::parse_from_str(&r[5], "%Y-%m-%dT%H:%M:%S%.fZ").expect("time");
        let local = (utc + chrono::TimeDelta::hours(2)).format("%Y-%m-%dT%H:%M:%S%.3f+02:00");
        let time = local.to_string().replace('.', ",");
        let mut f = r.clone();
        f[5] = time;
        text.push_str(&f.join(";").replace("0,000+", "0+"));
        text.push('\n');
    }
    let path = temp("forms_offsets.csv", text.as_bytes());
    assert_same_result("offsets", &reduce(&path, &[]));
}

/// A row giving a position on the disc (no contact; what `measure` writes) is set aside with
/// a sentence saying that positions are not reduced yet, and the contacts of the same file
/// are reduced as without it.
#[test]
fn a_position_row_is_set_aside_and_the_contacts_reduced() {
    let demo = std::fs::read_to_string(concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/src/data/demo_campaign.csv"
    ))
    .unwrap();
    let plain = reduce(&temp("positions_none.csv", demo.as_bytes()), &[]);
    let header = demo.lines().find(|l| l.starts_with("station,")).unwrap();
    let with = demo.replacen(
        header,
        &format!("{header},separation_solar_radii,sigma_solar_radii"),
        1,
    ) + "Kauri Point,-36.85,174.76,20,,2012-06-05T23:00:00Z,,0.61234,0.0005\n";
    let got = reduce(&temp("positions_one.csv", with.as_bytes()), &[]);
    assert_eq!(got["parallax_arcsec"], plain["parallax_arcsec"]);
    let set_aside = got["rejected"]
        .as_array()
        .unwrap()
        .iter()
        .find(|r| r["station"] == "Kauri Point")
        .expect("the position row listed");
    assert_eq!(set_aside["reason"], "invalid");
    assert!(
        set_aside["diagnosis"]
            .as_str()
            .unwrap()
            .contains("does not reduce positions yet"),
        "{set_aside}"
    );
}
