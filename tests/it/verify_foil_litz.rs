//! A foil or litz winding's resistance off its prediction: the readings name the foil
//! thickness or the strands carrying the current that the reading implies, never a round wire
//! size, each held to the resistivity worked by hand (IEC 60028: rho20 = 1/58 ohm mm^2/m,
//! annealed copper).

use crate::common::{assert_rel, eval};
use turnstack::engine::conductor::ConductorFigures;
use turnstack::engine::verify::{Finding, Quantity, verify};
use turnstack::engine::verify_conductor::ImpliedConductor;
use turnstack::report::verify::finding_words;

/// IEC 60028: resistivity of annealed copper at 20 C (ohm mm^2 / m).
const RHO20: f64 = 1.0 / 58.0;

fn example_text() -> String {
    let p = concat!(env!("CARGO_MANIFEST_DIR"), "/examples/foil-litz-300k.toml");
    std::fs::read_to_string(p).unwrap()
}

/// The example's foil secondary S is 0.1 mm thick; a reading at 20 C as if it were 0.08 mm,
/// by hand R = rho20 L / (t w) over the plan's length and width, implies 0.08 mm; and the
/// engine's expected value is the same relation at 0.1 mm.
#[test]
fn a_foil_reading_off_names_the_thickness_it_implies_iec_60028() {
    let (_, plan) = eval(&example_text());
    let s = plan
        .windings
        .iter()
        .find(|w| w.name.as_ref() == "S")
        .unwrap();
    let ConductorFigures::Foil { width_mm, .. } = s.conductor else {
        panic!("S is foil")
    };
    let r = RHO20 * s.length_m / (0.08 * width_mm);
    let (b, e) = eval(&format!(
        "{}\n[measured]\nreading_c = 20.0\ndcr_ohm = {{ S = {r} }}\n",
        example_text()
    ));
    let v = verify(&b, &e).unwrap();
    let c = v
        .checks
        .iter()
        .find(|c| {
            c.quantity
                == Quantity::Dcr {
                    winding: "S".into(),
                }
        })
        .unwrap();
    let p = c.prediction.as_ref().unwrap();
    assert_rel(
        p.expected,
        RHO20 * s.length_m / (0.1 * width_mm),
        1e-4,
        "rho L / (t w)",
    );
    match &c.findings[..] {
        [
            f @ Finding::ResistanceOff {
                likely_wire: None,
                conductor: Some(ImpliedConductor::FoilThickness { implied_mm, .. }),
                ..
            },
        ] => {
            assert_rel(*implied_mm, 0.08, 1e-4, "foil thickness implied");
            let words = finding_words(f);
            assert!(
                words.contains("foil 0.080 mm thick instead of 0.100 mm"),
                "{words}"
            );
            assert!(
                !words.contains("awg") && !words.contains("wrong wire"),
                "{words}"
            );
        }
        other => panic!("expected a foil thickness, got {other:?}"),
    }
}

/// The example's litz primary P is 60 strands of 0.1 mm; a reading at 20 C as if only 45
/// carried the current, by hand R = rho20 lay L / (45 pi 0.1^2 / 4), implies 45 of 60: the
/// words say strands left in their enamel or broken at the ends (common practice: the usual
/// fault of a litz termination).
#[test]
fn a_litz_reading_off_names_the_strands_it_implies_iec_60028() {
    let (_, plan) = eval(&example_text());
    let pw = plan
        .windings
        .iter()
        .find(|w| w.name.as_ref() == "P")
        .unwrap();
    let ConductorFigures::Litz { lay_factor, .. } = pw.conductor else {
        panic!("P is litz")
    };
    let strand_area = std::f64::consts::PI * 0.1 * 0.1 / 4.0;
    let r = RHO20 * lay_factor * pw.length_m / (45.0 * strand_area);
    let (b, e) = eval(&format!(
        "{}\n[measured]\nreading_c = 20.0\ndcr_ohm = {{ P = {r} }}\n",
        example_text()
    ));
    let v = verify(&b, &e).unwrap();
    let c = v
        .checks
        .iter()
        .find(|c| {
            c.quantity
                == Quantity::Dcr {
                    winding: "P".into(),
                }
        })
        .unwrap();
    let p = c.prediction.as_ref().unwrap();
    let by_hand = RHO20 * lay_factor * pw.length_m / (60.0 * strand_area);
    assert_rel(p.expected, by_hand, 1e-4, "rho lay L / (n A)");
    match &c.findings[..] {
        [
            f @ Finding::ResistanceOff {
                likely_wire: None,
                conductor:
                    Some(ImpliedConductor::LitzStrands {
                        implied, planned, ..
                    }),
                ..
            },
        ] => {
            assert_eq!(*planned, 60);
            assert_rel(*implied, 45.0, 1e-4, "strands implied");
            let words = finding_words(f);
            assert!(words.contains("45 of the 60 strands"), "{words}");
            assert!(words.contains("broken at the ends"), "{words}");
        }
        other => panic!("expected litz strands, got {other:?}"),
    }
}
