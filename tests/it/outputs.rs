//! Several outputs in a build (`[[output]]`, FORMAT.md "Several outputs"): the voltage a
//! further output's turns make, each secondary's RMS current, the primary's pulse from every
//! output's reflected load, the refusals with their line and column, and the round trip of a
//! save. Every expected figure is worked by hand below from the textbook relations of the
//! forward converter (continuous conduction, ideal switch and diodes, output inductor ripple
//! neglected: the usual first design pass, common practice).

use crate::common::{assert_rel, eval, parse};
use std::path::Path;
use turnstack::files::{self, BobbinLibrary, build_text};
use turnstack::model::Role;

/// The project's own two-output job: a 20-28 V rail, 5 V 4 A regulated (0.5 V Schottky
/// drop) and 12 V 0.5 A from the turns (0.7 V silicon drop), Np 24, Ns 16, N12 37, Nr 24,
/// 100 kHz. `core` is an optional `[bobbin.core]` table; `operating` and `outputs` the
/// tables' lines.
fn job(core: &str, operating: &str, outputs: &str) -> String {
    format!(
        "format = 1\ntitle = \"two outputs\"\n\n\
         [bobbin]\nname = \"test former\"\n\
         [bobbin.window]\nwidth_mm = 15.2\nheight_mm = 4.0\n\
         [bobbin.tube]\nshape = \"rect\"\nwidth_mm = 8.7\ndepth_mm = 8.7\ncorner_radius_mm = 0.5\n\
         {core}\n\
         [setup]\ntemperature_c = 100\nfrequency_khz = 100\n\n\
         [[winding]]\nname = \"P\"\nrole = \"primary\"\nturns = 24\nwire = \"0.5mm\"\n\n\
         [[winding]]\nname = \"S5\"\nrole = \"secondary\"\nturns = 16\nwire = \"0.8mm\"\n\n\
         [[winding]]\nname = \"S12\"\nrole = \"secondary\"\nturns = 37\nwire = \"0.3mm\"\n\n\
         [[winding]]\nname = \"R\"\nrole = \"reset\"\nturns = 24\nwire = \"0.25mm\"\n\n\
         [[stack]]\nwinding = \"P\"\n\n[[stack]]\ntape = 1\n\n[[stack]]\nwinding = \"S5\"\n\n\
         [[stack]]\ntape = 1\n\n[[stack]]\nwinding = \"S12\"\n\n[[stack]]\nwinding = \"R\"\n\n\
         [operating]\nvin_min_v = 20\nvin_max_v = 28\nrectifier_drop_v = 0.5\nduty_limit = 0.45\n\
         {operating}\n\
         {outputs}"
    )
}

const TWO_OUTPUTS: &str = "[[output]]\nname = \"S5\"\nvout_v = 5\niout_a = 4\n\n\
     [[output]]\nname = \"S12\"\nvout_v = 12\niout_a = 0.5\nrectifier_drop_v = 0.7\n";

/// No core data: no magnetising current, so the primary is the flat-topped reflected load.
fn two_outputs() -> String {
    job("", "", TWO_OUTPUTS)
}

/// Hand arithmetic shared by the tests below.
/// D = (Vreg + Vd) Np / (Nreg Vin_min) = 5.5 x 24 / (16 x 20) = 132 / 320 = 0.4125.
const D: f64 = 0.4125;

/// Forward converter in continuous conduction (common practice): an output's winding sees
/// Vin Nk/Np while the switch is on, so Vk + Vd_k = D Vin Nk/Np = (Vreg + Vd_reg) Nk/Nreg.
/// By hand: V12 = 5.5 x 37 / 16 - 0.7 = 203.5 / 16 - 0.7 = 12.71875 - 0.7 = 12.01875 V,
/// 0.01875 V (0.156 %) above its 12 V target.
#[test]
fn second_output_voltage_from_turns_matches_the_volt_second_balance_by_hand() {
    let (_, e) = eval(&two_outputs());
    let c = e.converter.as_ref().expect("converter figures");
    assert_rel(
        c.duty_needed_at_vin_min,
        D,
        1e-12,
        "duty from the regulated output",
    );
    assert_eq!(c.outputs.len(), 2);
    let (reg, relay) = (&c.outputs[0], &c.outputs[1]);
    assert!(reg.regulated && !relay.regulated);
    assert_eq!(
        (reg.winding.as_str(), relay.winding.as_str()),
        ("S5", "S12")
    );
    assert_rel(
        reg.vout_from_turns_v,
        5.0,
        1e-12,
        "the regulated output is held",
    );
    assert_rel(
        relay.vout_from_turns_v,
        12.01875,
        1e-12,
        "V12 from the turns",
    );
    assert_rel(relay.error_v, 0.01875, 1e-9, "V12 error");
    assert_rel(
        relay.error_fraction,
        0.01875 / 12.0,
        1e-9,
        "V12 error fraction",
    );
    assert_rel(relay.rectifier_drop_v, 0.7, 1e-12, "its own drop");
    assert_rel(
        reg.rectifier_drop_v,
        0.5,
        1e-12,
        "[operating]'s drop by default",
    );
}

/// A flat-topped pulse of height I over a fraction D of the period has the RMS I sqrt(D)
/// (common practice, continuous conduction, ripple neglected). sqrt(0.4125) = 0.642262, so
/// S5 carries 4 x 0.642262 = 2.569047 A and S12 0.5 x 0.642262 = 0.321131 A.
#[test]
fn each_secondary_rms_is_its_own_output_current_times_sqrt_d() {
    let (_, e) = eval(&two_outputs());
    let by = |n: &str| e.windings.iter().find(|w| w.name == n).unwrap();
    assert_rel(by("S5").current_rms_a.unwrap(), 2.569047, 1e-6, "S5 rms");
    assert_rel(by("S12").current_rms_a.unwrap(), 0.321131, 1e-5, "S12 rms");
    let c = e.converter.as_ref().unwrap();
    assert_rel(
        c.outputs[1].current_rms_a.unwrap(),
        0.321131,
        1e-5,
        "the outputs list carries the winding's RMS",
    );
    // Copper area of 0.3 mm wire: pi 0.3^2 / 4 = 0.0706858 mm^2: 0.321131 / 0.0706858
    // = 4.5431 A/mm^2.
    assert_rel(
        by("S12").current_density_a_mm2.unwrap(),
        4.5431,
        1e-4,
        "S12 current density",
    );
}

/// The primary carries, while the switch is on, the sum of every output's current referred
/// through the turns (ideal transformer, ampere-turn balance; common practice):
/// 4 x 16/24 + 0.5 x 37/24 = 2.666667 + 0.770833 = 3.4375 A. Without core data there is no
/// magnetising current, so I_p = sqrt(D) x 3.4375 = 0.642262 x 3.4375 = 2.207774 A.
#[test]
fn primary_rms_is_sqrt_d_times_the_sum_of_reflected_loads() {
    let (b, e) = eval(&two_outputs());
    let c = e.converter.as_ref().unwrap();
    assert_rel(c.reflected_a, 3.4375, 1e-12, "reflected load");
    assert!(c.magnetising_peak_a.is_none());
    let p = &e.windings[b.winding_index("P").unwrap()];
    assert_rel(p.current_rms_a.unwrap(), 2.207774, 1e-6, "primary rms");
    // The turn-off peak is the whole reflected load (no magnetising peak here).
    assert_rel(c.clamp_peak_a.unwrap(), 3.4375, 1e-12, "clamp peak");
}

/// With a core of AL 2000 nH: Lm = AL Np^2 = 2000e-9 x 576 = 1.152 mH, and the magnetising
/// current rises over the on-time by Vin D T / Lm = 20 x 0.4125 x 10 us / 1.152 mH
/// = 71.615 mA. The primary's pulse then runs from a = 3.4375 A to b = 3.509115 A, and a
/// straight piece over D has the RMS sqrt(D (a^2 + a b + b^2) / 3):
/// a^2 = 11.816406, a b = 12.062582, b^2 = 12.313889; sum 36.192877, / 3 = 12.064292,
/// x D = 4.976521, sqrt = 2.230812 A.
#[test]
fn primary_rms_adds_the_magnetising_ramp_as_the_engine_models_it() {
    let core = "[bobbin.core]\nae_mm2 = 52.0\nle_mm = 58.0\nal_nh = 2000\n";
    let (b, e) = eval(&job(core, "", TWO_OUTPUTS));
    let c = e.converter.as_ref().unwrap();
    assert_rel(
        c.magnetising_peak_a.unwrap(),
        0.0716146,
        1e-5,
        "magnetising peak",
    );
    let p = &e.windings[b.winding_index("P").unwrap()];
    assert_rel(p.current_rms_a.unwrap(), 2.230812, 1e-6, "primary rms");
    assert_rel(
        c.clamp_peak_a.unwrap(),
        3.4375 + 0.0716146,
        1e-6,
        "clamp peak",
    );
}

/// Reset to the output returns the energy to the regulated output: the reset duty limit is
/// Np Vo' / (Np Vo' + Nr Vin_max) with Vo' the regulated 5.5 V (FORMAT.md). With Nr = 12:
/// 24 x 5.5 / (24 x 5.5 + 12 x 28) = 132 / 468 = 0.282051.
#[test]
fn secondary_side_reset_returns_to_the_regulated_output() {
    let text = two_outputs()
        .replace(
            "name = \"R\"\nrole = \"reset\"\nturns = 24",
            "name = \"R\"\nrole = \"reset\"\nturns = 12",
        )
        .replace("[operating]\n", "[operating]\nreset_side = \"secondary\"\n");
    let (_, e) = eval(&text);
    let c = e.converter.as_ref().unwrap();
    assert_rel(c.reset_duty_limit, 132.0 / 468.0, 1e-12, "reset duty limit");
    // And the switch sees Vin_max + Vo' Np/Nr = 28 + 5.5 x 2 = 39 V.
    assert_rel(c.switch_voltage_v, 39.0, 1e-12, "switch voltage");
}

/// The shorthand and a single `[[output]]` on the first secondary say the same thing: every
/// figure agrees (the outputs list aside), and a second secondary without an output then
/// carries no load.
#[test]
fn one_output_table_gives_the_shorthand_figures_and_an_unlisted_secondary_no_load() {
    let one = "[[output]]\nname = \"S5\"\nvout_v = 5\niout_a = 4\n";
    let (_, table) = eval(&job("", "", one));
    let (_, short) = eval(&job("", "vout_v = 5\niout_a = 4", ""));
    let (mut tc, sc) = (table.converter.clone().unwrap(), short.converter.unwrap());
    assert_eq!(tc.outputs.len(), 1);
    assert!(sc.outputs.is_empty(), "the shorthand lists no outputs");
    tc.outputs.clear();
    assert_eq!(tc, sc);
    for (a, b) in table.windings.iter().zip(&short.windings) {
        assert_eq!(a.current_rms_a, b.current_rms_a, "{}", a.name);
    }
    let s12 = table.windings.iter().find(|w| w.name == "S12").unwrap();
    assert!(
        s12.current_rms_a.is_none(),
        "S12 feeds no output: no current from the operating point"
    );
    // Reflected: 4 x 16/24 = 2.666667 A only.
    assert_rel(sc.reflected_a, 4.0 * 16.0 / 24.0, 1e-12, "reflected");
}

/// `[operating] vout_v` beside `[[output]]` tables is accepted when it says what the first
/// output says, refused at its line and column when it does not.
#[test]
fn shorthand_beside_outputs_must_agree_with_the_regulated_output() {
    let agree = job("", "vout_v = 5\niout_a = 4", TWO_OUTPUTS);
    let b = parse(&agree);
    assert_eq!(b.operating.as_ref().unwrap().outputs.len(), 2);
    let (line, col, msg) = refusal(&job("", "vout_v = 6", TWO_OUTPUTS));
    let at = line_of(&job("", "vout_v = 6", TWO_OUTPUTS), "vout_v = 6");
    assert_eq!((line, col), (at, 10), "{msg}");
    assert!(
        msg.contains("operating.vout_v") && msg.contains("disagrees"),
        "{msg}"
    );
}

/// The refusals FORMAT.md lists, each pointing at the output's `name` (line, column 8).
#[test]
fn bad_outputs_are_refused_at_their_line_and_column() {
    let cases = [
        (
            "name = \"S12\"",
            "name = \"Q\"",
            "unknown winding \"Q\"; the secondaries are S5, S12",
        ),
        ("name = \"S12\"", "name = \"R\"", "\"R\" is a reset winding"),
        (
            "name = \"S12\"",
            "name = \"S5\"",
            "\"S5\" already feeds output #1",
        ),
    ];
    for (from, to, words) in cases {
        let text = job("", "", &TWO_OUTPUTS.replace(from, to));
        let (line, col, msg) = refusal(&text);
        // The second [[output]]'s name: the last line with that text.
        let want = text
            .lines()
            .enumerate()
            .filter(|(_, l)| *l == to)
            .map(|(i, _)| i + 1)
            .last()
            .unwrap();
        assert_eq!((line, col), (want, 8), "{msg}");
        assert!(
            msg.contains("output #2 name") && msg.contains(words),
            "{msg}"
        );
    }
    // The regulated output must be the first secondary in file order.
    let swapped = TWO_OUTPUTS
        .replace("name = \"S5\"\nvout_v = 5", "name = \"X\"\nvout_v = 5")
        .replace("name = \"S12\"\nvout_v = 12", "name = \"S5\"\nvout_v = 12")
        .replace("name = \"X\"\nvout_v = 5", "name = \"S12\"\nvout_v = 5");
    let swapped = job("", "", &swapped);
    let (line, col, msg) = refusal(&swapped);
    let want = line_of(&swapped, "name = \"S12\"\nvout_v = 5");
    assert_eq!((line, col), (want, 8), "{msg}");
    assert!(
        msg.contains("first secondary winding in file order, \"S5\""),
        "{msg}"
    );
    // Outputs without an operating point.
    let bare = two_outputs().replace(
        "[operating]\nvin_min_v = 20\nvin_max_v = 28\nrectifier_drop_v = 0.5\nduty_limit = 0.45\n",
        "",
    );
    let (line, col, msg) = refusal(&bare);
    assert_eq!((line, col), (line_of(&bare, "[[output]]"), 1), "{msg}");
    assert!(msg.contains("need an [operating] point"), "{msg}");
    // The shorthand without its output.
    let (_, _, msg) = refusal(&job("", "", ""));
    assert!(msg.contains("missing key `vout_v`"), "{msg}");
    // A negative current.
    let text = two_outputs().replace("iout_a = 0.5", "iout_a = -0.5");
    let (line, col, msg) = refusal(&text);
    assert_eq!((line, col), (line_of(&text, "iout_a = -0.5"), 10), "{msg}");
}

/// Saving keeps the `[[output]]` tables, their comments and the agreeing shorthand, writes a
/// changed value in place, and reads back as the same build.
#[test]
fn outputs_survive_a_save_with_their_comments() {
    let text = job(
        "",
        "vout_v = 5   # said twice, on purpose\niout_a = 4",
        TWO_OUTPUTS,
    )
    .replace(
        "[[output]]\nname = \"S12\"",
        "# the relay rail\n[[output]]\nname = \"S12\"",
    )
    .replace("iout_a = 0.5", "iout_a = 0.5   # two relays");
    let mut b = parse(&text);
    let target = Path::new("test.toml");
    let (same, _) = build_text(&b, Some(&text), target);
    assert_eq!(
        same, text,
        "an unedited save writes the file back byte for byte"
    );
    {
        let op = b.operating.as_mut().unwrap();
        op.outputs[1].iout_a = 0.75;
        op.set_regulated(5.0, 3.0);
    }
    let (saved, _) = build_text(&b, Some(&text), target);
    assert!(
        saved.contains("# the relay rail\n[[output]]\nname = \"S12\""),
        "{saved}"
    );
    assert!(saved.contains("iout_a = 0.75   # two relays"), "{saved}");
    assert!(
        saved.contains("vout_v = 5   # said twice, on purpose\niout_a = 3"),
        "{saved}"
    );
    let back = files::parse_build(&saved, Some(target), &BobbinLibrary::bundled_only()).unwrap();
    assert_eq!(back, b);
    assert_eq!(back.operating.unwrap().outputs[0].iout_a, 3.0);
    // A new file gets the tidy text, which reads back the same.
    let tidy = turnstack::files::build_to_toml(&b);
    assert_eq!(tidy.matches("[[output]]").count(), 2, "{tidy}");
    let op_table = tidy
        .split("[operating]")
        .nth(1)
        .unwrap()
        .split("[[output]]")
        .next();
    assert!(
        !op_table.unwrap().contains("vout_v"),
        "no shorthand in the tidy text:\n{tidy}"
    );
    let again = files::parse_build(&tidy, Some(target), &BobbinLibrary::bundled_only()).unwrap();
    assert_eq!(again.operating, b.operating);
    assert_eq!(again.first_of(Role::Secondary).unwrap().name, "S5");
}

/// The loader's refusal: (line, column, the message with its place).
fn refusal(text: &str) -> (usize, usize, String) {
    let e = files::parse_build(
        text,
        Some(Path::new("test.toml")),
        &BobbinLibrary::bundled_only(),
    )
    .expect_err("refused");
    (e.line.unwrap_or(0), e.column.unwrap_or(0), e.to_string())
}

/// The 1-based line where `needle` starts.
fn line_of(text: &str, needle: &str) -> usize {
    let at = text.find(needle).expect("the text is there");
    text[..at].matches('\n').count() + 1
}

/// The planner's check panel lists the voltage the further output's turns make (12.02 V by
/// the hand arithmetic above for examples/two-output.toml, which has the same turns and
/// drops), and follows the turns: one turn more on S12 makes 5.5 x 38 / 16 - 0.7 = 12.3625 V.
#[test]
fn check_panel_shows_the_further_output_voltage() {
    use crate::tui_support::screen;
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/two-output.toml");
    let b = files::load_build(&path).unwrap();
    let mut app = turnstack::tui::App::new(b, None);
    app.ui.theme = turnstack::tui::theme::Theme::plain();
    let text = screen(&app, 120, 40);
    assert!(
        text.lines()
            .any(|l| l.contains("S12 V") && l.contains("12.02")),
        "{text}"
    );
    let k = app.doc.build.winding_index("S12").unwrap();
    let mut edited = app.doc.build.clone();
    edited.windings[k].turns = 38;
    app = turnstack::tui::App::new(edited, None);
    app.ui.theme = turnstack::tui::theme::Theme::plain();
    let text = screen(&app, 120, 40);
    assert!(
        text.lines()
            .any(|l| l.contains("S12 V") && l.contains("12.36")),
        "{text}"
    );
}

/// An output whose turns miss its target by more than 5 % (common practice, from memory) is
/// warned, with what one turn moves it. 40 turns: 5.5 x 40 / 16 - 0.7 = 13.05 V, +8.75 %
/// against 12 V, one turn 5.5 / 16 = 0.34375 V; 36 turns: 12.375 - 0.7 = 11.675 V, -2.7 %,
/// within the band.
#[test]
fn an_output_far_from_its_target_is_warned_with_the_step_of_one_turn() {
    let with = |turns: u32| {
        let text = two_outputs().replace(
            "name = \"S12\"\nrole = \"secondary\"\nturns = 37",
            &format!("name = \"S12\"\nrole = \"secondary\"\nturns = {turns}"),
        );
        eval(&text).1
    };
    let e = with(40);
    let w = e
        .warnings
        .iter()
        .find(|w| w.code() == "output-off-target")
        .expect("warned");
    let m = w.message();
    assert!(m.contains("13.05 V against a 12 V target (+8.8 %)"), "{m}");
    assert!(m.contains("by 0.34 V"), "{m}");
    assert_rel(
        e.converter.as_ref().unwrap().outputs[1].error_fraction,
        0.0875,
        1e-9,
        "error",
    );
    let e = with(36);
    assert_rel(
        e.converter.as_ref().unwrap().outputs[1].vout_from_turns_v,
        11.675,
        1e-12,
        "36 turns",
    );
    assert!(e.warnings.iter().all(|w| w.code() != "output-off-target"));
}

/// The planner's operating form edits the regulated output, in the first `[[output]]` too:
/// 3 A on S5 makes the reflected load 3 x 16/24 + 0.5 x 37/24 = 2 + 0.770833 = 2.770833 A.
#[test]
fn the_operating_form_edits_the_regulated_output() {
    use crate::tui_support::press;
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/two-output.toml");
    let mut app = turnstack::tui::App::new(files::load_build(&path).unwrap(), None);
    // The form's sixth row (the add row is hidden): the output current.
    press(&mut app, "V<down><down><down><down><down><enter>");
    press(&mut app, &"<bs>".repeat(20));
    press(&mut app, "3<enter>");
    let op = app.doc.build.operating.as_ref().unwrap();
    assert_eq!((op.iout_a, op.outputs[0].iout_a), (3.0, 3.0));
    let c = app.doc.eval.converter.as_ref().unwrap();
    assert_rel(c.reflected_a, 2.0 + 0.5 * 37.0 / 24.0, 1e-12, "reflected");
}
