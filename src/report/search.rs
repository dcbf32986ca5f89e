//! The search's findings in words: the engine returns which limit binds and which windings
//! keep their wire as data (`engine::search::{Binding, SearchNote}`); the command line and the
//! planner show these sentences.

use crate::engine::search::{Binding, LeastHeight, SearchNote};

/// The current-density band as it is written, e.g. `2.0-6.0 A/mm2`.
fn band(j_min_a_mm2: f64, j_max_a_mm2: f64) -> String {
    format!("{j_min_a_mm2:.1}-{j_max_a_mm2:.1} A/mm2")
}

/// Which limit binds and why, in one sentence any front end can show.
pub fn binding_sentence(b: &Binding) -> String {
    match b {
        Binding::EmptySpace => "the space is empty: no wire in the series suits the windings".into(),
        Binding::CurrentBand {
            j_min_a_mm2,
            j_max_a_mm2,
            windings,
        } => {
            let who = if windings.is_empty() {
                "no one choice puts every winding inside it together".to_string()
            } else {
                let names: Vec<&str> = windings.iter().map(|n| n.as_str()).collect();
                format!("no wire tried puts {} inside it", names.join(", "))
            };
            format!(
                "the current-density band ({}) binds: {who}",
                band(*j_min_a_mm2, *j_max_a_mm2)
            )
        }
        Binding::WindowHeight {
            j_min_a_mm2,
            j_max_a_mm2,
            in_band,
            least,
        } => {
            let least = match least {
                Some(LeastHeight::Evaluated {
                    height_mm,
                    window_mm,
                }) => format!(
                    "; the shortest needs {height_mm:.2} mm with the allowance against a {window_mm:.2} mm window"
                ),
                Some(LeastHeight::Bound {
                    height_mm,
                    window_mm,
                }) => format!(
                    "; the thinnest needs at least {height_mm:.2} mm with the allowance against a {window_mm:.2} mm window"
                ),
                None => String::new(),
            };
            format!(
                "the window height binds: none of the {in_band} combinations with wire inside the {} band fits{least}",
                band(*j_min_a_mm2, *j_max_a_mm2)
            )
        }
        Binding::TemperatureRise => "the temperature rise binds: the builds that fit within the band run hotter than the limit".into(),
        Binding::Leakage => "the leakage limit binds: the builds that fit within the band leave more leakage than allowed".into(),
    }
}

/// The sentence with the command line's advice (the options that widen the band), as
/// `turnstack search` prints it and its JSON carries it.
pub fn binding_with_cli_advice(b: &Binding) -> String {
    let mut s = binding_sentence(b);
    if matches!(b, Binding::CurrentBand { .. }) {
        s.push_str("; widen it with --j-min / --j-max");
    }
    s
}

/// What the planner shows for a binding limit: the sentence without command-line advice.
pub fn binding_in_planner(b: &Binding) -> String {
    binding_sentence(b)
}

/// A remark on the space in words.
pub fn note_sentence(n: &SearchNote) -> String {
    match n {
        SearchNote::NoCurrent { winding } => format!(
            "\"{winding}\" has no current (no current_rms_a, none from an operating point): its wire is kept"
        ),
        SearchNote::NoWireSuits { winding, current_a } => {
            format!("no wire in the series suits \"{winding}\" at {current_a} A: its wire is kept")
        }
        SearchNote::ResetTurnsDiffer => {
            "reset and primary turns differ: the reset is not tried bifilar with the primary".into()
        }
    }
}
