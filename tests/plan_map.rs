//! `plan --map` as a user reads it: sites numbered with a key, the chosen ones marked apart,
//! `--map` without `--contact` a usage error saying what to add, and forecasts rounded to about
//! three significant digits of their uncertainty in the table.

mod common;

use common::{data, err, out, plan_venus_2012 as plan, temp};

#[test]
fn the_map_numbers_the_sites_with_a_key_and_marks_the_chosen() {
    let map = temp("plan-map.svg", b"");
    let o = plan(&[
        "--choose",
        "2",
        "--contact",
        "2",
        "--grid-deg",
        "10",
        "--map",
        &map,
    ]);
    assert!(o.status.success(), "{}", err(&o));
    let svg = std::fs::read_to_string(&map).unwrap();
    let sites = std::fs::read_to_string(data("candidate_sites.csv")).unwrap();
    let names: Vec<String> = sites
        .lines()
        .filter(|l| !l.starts_with('#') && !l.trim().is_empty())
        .skip(1)
        .map(|l| l.split(',').next().unwrap().to_string())
        .collect();
    assert!(svg.contains(">Sites</text>"), "no key");
    for (k, name) in names.iter().enumerate() {
        // Each site in the key as "number name" (names here are short and plain).
        assert!(
            svg.contains(&format!(">{} {name}</text>", k + 1)),
            "{name} not in key"
        );
    }
    // The two chosen sites: bold in the key and drawn as stars (filled, with their own title).
    let table = out(&o);
    assert!(svg.matches("font-weight=\"bold\">").count() >= 2);
    assert!(table.contains("Chosen (2, marked *)"), "{table}");
    assert!(svg.contains("filled stars: the chosen sites"));
    // The table numbers the sites as the key does.
    assert!(table.contains("  # site"), "{table}");
    assert!(table.contains(&format!("  1 {}", names[0])), "{table}");
}

#[test]
fn a_map_without_a_contact_says_what_to_add() {
    for option in ["--map", "--grid-csv"] {
        let o = plan(&[option, "x.out"]);
        assert_eq!(o.status.code(), Some(2), "{option}: {}", err(&o));
        assert!(
            err(&o).contains("add --contact 1, 2, 3 or 4"),
            "{option}: {}",
            err(&o)
        );
        assert!(!std::path::Path::new("x.out").exists());
    }
}

#[test]
fn forecasts_are_rounded_to_three_digits_of_their_uncertainty() {
    let o = plan(&["--choose", "3"]);
    assert!(o.status.success(), "{}", err(&o));
    let table = out(&o);
    let line = table
        .lines()
        .find(|l| l.starts_with("Forecast with every site"))
        .unwrap_or_else(|| panic!("{table}"));
    // "parallax +- 0.0815" (AU +- 1.39 million km)": three significant digits each.
    let au = line.split("AU +- ").nth(1).unwrap();
    let digits: String = au
        .split(' ')
        .next()
        .unwrap()
        .chars()
        .filter(char::is_ascii_digit)
        .collect();
    let significant = digits.trim_start_matches('0');
    assert!(
        significant.len() <= 3 || significant[3..].chars().all(|c| c == '0'),
        "{line}"
    );
    let parallax = line.split("parallax +- ").nth(1).unwrap();
    let p_digits: String = parallax
        .split('"')
        .next()
        .unwrap()
        .chars()
        .filter(char::is_ascii_digit)
        .collect();
    assert_eq!(p_digits.trim_start_matches('0').len(), 3, "{line}");
}
