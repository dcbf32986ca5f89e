//! `turnstack measure bobbin ...`: calliper readings and a test winding into a bobbin file.

use super::{Error, MeasureBobbin, emit, notice};
use crate::engine::measured_core::{self, GapReading, Leg, Measured};
use crate::engine::validate_bobbin;
use crate::files::{bobbin_to_toml, parse_bobbin, user_bobbin_dir, write_atomic};
use crate::model::Tube;
use std::fmt::Write as _;
use std::path::Path;
use std::process::ExitCode;

/// The error of a reading the command cannot use.
fn bad<T>(msg: &str) -> Result<T, Error> {
    Err(Error::input(msg))
}

fn id_ok(id: &str) -> bool {
    !id.is_empty()
        && !id.starts_with('.')
        && id
            .chars()
            .all(|c| c.is_ascii_alphanumeric() || matches!(c, '-' | '_' | '.'))
}

/// `measure bobbin`: prints the bobbin file the readings make and the core figures worked
/// out from them (Ae mm2, le mm, AL nH, mu_e, equivalent gap mm); saves it with `--save`.
pub fn bobbin(m: &MeasureBobbin) -> Result<ExitCode, Error> {
    let (measured, le_how) = readings(m)?;
    let bobbin = measured_core::bobbin_from(&measured);
    let problems = validate_bobbin(&bobbin);
    if let Some(p) = problems.first() {
        return bad(&format!("the readings do not make a bobbin: {p}"));
    }
    let toml = bobbin_to_toml(&bobbin);
    // The file must read back as the same bobbin; a failure here is a bug, not user input.
    if let Err(e) = parse_bobbin(&toml, None) {
        return bad(&format!(
            "internal error: the bobbin file does not read back: {e}"
        ));
    }

    let mut o = String::new();
    let _ = writeln!(o, "# {}.toml", m.id);
    o.push_str(&toml);
    core_figures(&mut o, &measured, &le_how, m.mu_i);
    emit(&o)?;
    if m.save {
        let Some(dir) = user_bobbin_dir() else {
            return bad("no data directory on this system: set TURNSTACK_BOBBINS to a folder");
        };
        return save(&dir, &m.id, &toml, m.force);
    }
    Ok(ExitCode::SUCCESS)
}

/// The readings as the engine's `Measured` core, with how le was found (empty when not
/// given); refuses an unusable id, tube or turn count with the message the user sees.
fn readings(m: &MeasureBobbin) -> Result<(Measured, String), Error> {
    if !id_ok(&m.id) {
        return bad(&format!(
            "--id \"{}\": use letters, digits, '-', '_' or '.' (it becomes the file name)",
            m.id
        ));
    }
    let tube = match (m.tube_rect, m.tube_round) {
        (Some((w, d)), None) => Tube::Rect {
            width_mm: w,
            depth_mm: d,
            corner_radius_mm: m.corner.unwrap_or(0.0),
        },
        (None, Some(d)) => Tube::Round { diameter_mm: d },
        _ => return bad("give the tube as --tube-rect WxD or --tube-round D"),
    };
    let leg = match (m.leg_rect, m.leg_round) {
        (Some((w, d)), None) => Some(Leg::Rect {
            width_mm: w,
            depth_mm: d,
        }),
        (None, Some(d)) => Some(Leg::Round { diameter_mm: d }),
        _ => None,
    };
    let (le_mm, le_how) = match (m.le, m.le_path) {
        (Some(le), _) => (Some(le), "entered".to_string()),
        (None, Some((along, across))) => (
            Some(measured_core::le_from_path_mm(along, across)),
            format!("estimated as 2 x ({along} + {across}) from the mean path round one window"),
        ),
        _ => (None, String::new()),
    };
    if m.turns == Some(0) {
        return bad("--turns must be at least 1");
    }
    let al_nh = match (m.turns, m.inductance_uh) {
        (Some(n), Some(l)) => Some(measured_core::al_nh(l, n)),
        _ => None,
    };
    if al_nh.is_some() && (leg.is_none() || le_mm.is_none()) {
        notice(
            "note: without --leg-rect/--leg-round and --le/--le-path only AL can be \
             worked out; the core data needs Ae and le",
        );
    }
    let mut origin = "Measured with callipers".to_string();
    if let Some(n) = m.turns {
        let _ = write!(
            origin,
            "; AL from a {n}-turn test winding of {} uH",
            m.inductance_uh.unwrap_or(0.0)
        );
    }
    if !le_how.is_empty() {
        let _ = write!(origin, "; le {le_how}");
    }
    let measured = Measured {
        name: m
            .name
            .clone()
            .unwrap_or_else(|| format!("{} (measured)", m.id)),
        origin,
        window_width_mm: m.window.0,
        window_height_mm: m.window.1,
        tube,
        leg,
        le_mm,
        al_nh,
        pin_count: m.pins,
    };
    Ok((measured, le_how))
}

/// The "Core figures" block: Ae (mm2), le (mm) and AL (nH), each with how it was found or
/// what to give for it, then mu_e and the equivalent gap when the readings allow.
fn core_figures(o: &mut String, measured: &Measured, le_how: &str, mu_i: Option<f64>) {
    let (leg, le_mm, al_nh) = (measured.leg, measured.le_mm, measured.al_nh);
    let _ = writeln!(o, "\nCore figures");
    match leg {
        Some(l) => {
            let how = match l {
                Leg::Rect { width_mm, depth_mm } => format!("{width_mm} x {depth_mm}"),
                Leg::Round { diameter_mm } => format!("pi x {diameter_mm}^2 / 4"),
            };
            let _ = writeln!(
                o,
                "  Ae  {:>9.2} mm2  centre leg {how} (the leg's own section: a first estimate)",
                l.area_mm2()
            );
        }
        None => {
            let _ = writeln!(
                o,
                "  Ae          -      give --leg-rect WxD or --leg-round D"
            );
        }
    }
    match le_mm {
        Some(le) => {
            let _ = writeln!(o, "  le  {le:>9.2} mm   {le_how}");
        }
        None => {
            let _ = writeln!(
                o,
                "  le          -      give --le (size family table) or --le-path ALONGxACROSS"
            );
        }
    }
    match al_nh {
        Some(al) => {
            let _ = writeln!(o, "  AL  {al:>9.1} nH   L / N^2 from the test winding");
        }
        None => {
            let _ = writeln!(
                o,
                "  AL          -      wind N turns, measure L, give --turns N --inductance-uh L"
            );
        }
    }
    if let (Some(al), Some(le), Some(l)) = (al_nh, le_mm, leg) {
        permeability(o, al, le, l, mu_i);
    }
}

/// mu_e from AL (nH), le (mm) and the leg's section, and with the material's mu_i the
/// equivalent gap (mm) with what it says about the mating faces.
fn permeability(o: &mut String, al: f64, le: f64, l: Leg, mu_i: Option<f64>) {
    let mu_e = measured_core::mu_e(al, le, l.area_mm2());
    let _ = writeln!(
        o,
        "  mu_e {mu_e:>8.0}        AL le / (mu0 Ae): effective permeability"
    );
    match mu_i {
        Some(mu_i) => {
            let gap = measured_core::equivalent_gap_mm(mu_e, mu_i, le);
            let _ = writeln!(
                o,
                "  gap {gap:>9.3} mm   le (1/mu_e - 1/mu_i) with mu_i {mu_i}: the air in the whole path"
            );
            let say = match measured_core::read_gap(gap) {
                GapReading::Negative => "mu_e is above the mu_i you stated: the material's \
                    permeability is higher than you think, or le or Ae is off."
                    .to_string(),
                GapReading::Clean => format!(
                    "under {:.0} um: as expected of clean, ground mating faces.",
                    measured_core::CLEAN_FACE_GAP_MM * 1000.0
                ),
                GapReading::Gapped => "a gap: the core is gapped on purpose, or its mating \
                    faces are dirty, glued or chipped (glue and grit show up as a gap; an E \
                    pair has it twice, centre and outer legs). Clean the faces and measure \
                    again before trusting AL."
                    .to_string(),
            };
            for l in crate::report::wrap(&say, 72, "") {
                let _ = writeln!(o, "       {l}");
            }
        }
        None => {
            let _ = writeln!(
                o,
                "  gap         -      give --mu-i (the material's permeability) for the equivalent gap"
            );
        }
    }
}

fn save(dir: &Path, id: &str, toml: &str, force: bool) -> Result<ExitCode, Error> {
    if let Err(e) = std::fs::create_dir_all(dir) {
        return bad(&format!("cannot create {}: {e}", dir.display()));
    }
    let path = dir.join(format!("{id}.toml"));
    if path.exists() && !force {
        return bad(&format!(
            "{} exists: not replaced (add --force to replace it)",
            path.display()
        ));
    }
    if let Err(e) = write_atomic(&path, toml) {
        return bad(&format!("cannot write {}: {e}", path.display()));
    }
    notice(&format!("saved {}", path.display()));
    Ok(ExitCode::SUCCESS)
}
