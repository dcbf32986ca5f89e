//! `turnstack bobbins` and `turnstack wires`.

use super::{EXIT_BAD_INPUT, Error, emit, emit_listing, json_text};
use crate::engine::resistance::ohm_per_m;
use crate::files::{BobbinEntry, BobbinLibrary, BobbinOrigin, user_bobbin_dir};
use crate::library::wires::catalogue;
use crate::model::Tube;
use crate::report::textfmt::truncate;
use serde::Serialize;
use std::fmt::Write as _;
use std::process::ExitCode;

/// One entry of `bobbins --json`: a bobbin that loads, or the error of one that does not.
#[derive(Serialize)]
#[serde(untagged)]
enum BobbinJson<'a> {
    Read {
        id: &'a str,
        origin: &'static str,
        name: &'a str,
        window_width_mm: f64,
        window_height_mm: f64,
        /// `null` without core data.
        ae_mm2: Option<f64>,
    },
    Unreadable {
        id: &'a str,
        origin: &'static str,
        error: String,
    },
}

/// One row of `wires --json`.
#[derive(Serialize)]
struct WireJson {
    wire: Option<String>,
    bare_mm: f64,
    od_grade1_mm: f64,
    od_grade2_mm: f64,
    od_grade3_mm: f64,
    od_tiw_mm: f64,
    ohm_per_m_20c: f64,
    confirmed: bool,
}

pub fn bobbins(as_json: bool) -> Result<ExitCode, Error> {
    let entries = BobbinLibrary::standard().entries();
    if as_json {
        return emit_listing(&json_text(&bobbins_json(&entries)));
    }
    let mut o = String::new();
    let _ = writeln!(
        o,
        "{:<14} {:<9} {:>7} {:>7}  {:<13} {:>6}  name",
        "id", "from", "width", "height", "tube", "Ae"
    );
    let _ = writeln!(
        o,
        "{:<14} {:<9} {:>7} {:>7}  {:<13} {:>6}",
        "", "", "mm", "mm", "mm", "mm2"
    );
    let mut broken = false;
    for e in &entries {
        match &e.bobbin {
            Ok(b) => {
                let tube = match b.tube {
                    Tube::Rect {
                        width_mm, depth_mm, ..
                    } => format!("{width_mm:.1} x {depth_mm:.1}"),
                    Tube::Round { diameter_mm } => format!("dia {diameter_mm:.1}"),
                };
                let ae = b
                    .core
                    .as_ref()
                    .map_or("-".to_string(), |c| format!("{:.1}", c.ae_mm2));
                let _ = writeln!(
                    o,
                    "{:<14} {:<9} {:>7.2} {:>7.2}  {:<13} {:>6}  {}",
                    truncate(&e.id, 14),
                    e.origin.label(),
                    b.window.width_mm,
                    b.window.height_mm,
                    tube,
                    ae,
                    truncate(&b.name, 16)
                );
            }
            Err(err) => {
                broken = true;
                let _ = writeln!(
                    o,
                    "{:<14} {:<9} cannot be read: {err}",
                    truncate(&e.id, 14),
                    e.origin.label()
                );
            }
        }
    }
    user_folder_line(&mut o, &entries);
    let _ = writeln!(
        o,
        "bundled figures are typical for the size:\nmeasure your own bobbin before trusting a fit"
    );
    emit(&o)?;
    // The listing shows each broken file's error in its row; the exit code says there was one.
    Ok(if broken {
        ExitCode::from(EXIT_BAD_INPUT)
    } else {
        ExitCode::SUCCESS
    })
}

pub fn wires(as_json: bool) -> Result<ExitCode, Error> {
    let rows = catalogue();
    if as_json {
        let list: Vec<_> = rows
            .iter()
            .map(|r| WireJson {
                wire: r.size.key(),
                bare_mm: r.bare_mm,
                od_grade1_mm: r.od_mm[0],
                od_grade2_mm: r.od_mm[1],
                od_grade3_mm: r.od_mm[2],
                od_tiw_mm: r.od_mm[3],
                ohm_per_m_20c: ohm_per_m(r.bare_mm, 1, 20.0),
                confirmed: r.confirmed,
            })
            .collect();
        return emit_listing(&json_text(&list));
    }
    let mut o = String::new();
    let _ = writeln!(
        o,
        "{:<9} {:>8} {:>8} {:>8} {:>8} {:>8} {:>10}",
        "wire", "bare", "grade 1", "grade 2", "grade 3", "TIW", "ohm/m"
    );
    let _ = writeln!(
        o,
        "{:<9} {:>8} {:>8} {:>8} {:>8} {:>8} {:>10}",
        "", "mm", "od mm", "od mm", "od mm", "od mm", "at 20 C"
    );
    for r in &rows {
        let mark = if r.confirmed { " *" } else { "" };
        let _ = writeln!(
            o,
            "{:<9} {:>8.4} {:>8.3} {:>8.3} {:>8.3} {:>8.3} {:>10.4}{mark}",
            r.size.key().unwrap_or_default(),
            r.bare_mm,
            r.od_mm[0],
            r.od_mm[1],
            r.od_mm[2],
            r.od_mm[3],
            ohm_per_m(r.bare_mm, 1, 20.0)
        );
    }
    let _ = writeln!(
        o,
        "\nAWG bare diameters: ASTM B258 formula. Metric overall diameters: IEC 60317-0-1\n\
         maxima; * = row read in the standard's table, others from memory; AWG and\n\
         in-between sizes by rule."
    );
    let _ = writeln!(
        o,
        "TIW: typical figures (bare + 0.2 mm). Resistance: IEC 60028 annealed copper."
    );
    conductor_tables(&mut o);
    emit_listing(&o)
}

/// The foil and litz sections of `wires` (text only; `--json` lists the round wires).
fn conductor_tables(o: &mut String) {
    use crate::engine::conductor::{litz_bundle_for, litz_ohm_per_m};
    use crate::library::conductors::{FOIL_THICKNESSES_MM, LITZ_CONSTRUCTIONS};
    use crate::model::{Insulation, Litz};
    let _ = writeln!(
        o,
        "\nFoil (wire = {{ foil_mm = T }}): common thicknesses, mm, with ohm/m at 20 C a\n\
         10 mm width"
    );
    for t in FOIL_THICKNESSES_MM {
        let r = crate::engine::resistance::rho_ohm_m(20.0) / (t * 10.0 * 1e-6);
        let _ = writeln!(o, "  foil {t:<6} {r:>10.5}");
    }
    let _ = writeln!(
        o,
        "\nLitz (wire = {{ litz_strands = N, strand_mm = D }}): common constructions,\n\
         grade 1 strands, packing 0.75, serving 0.05 mm, lay factor 1.03"
    );
    let _ = writeln!(
        o,
        "  {:<12} {:>8} {:>9} {:>8} {:>10}",
        "litz", "copper", "bundle", "served", "ohm/m"
    );
    let _ = writeln!(
        o,
        "  {:<12} {:>8} {:>9} {:>8} {:>10}",
        "", "mm2", "mm", "od mm", "at 20 C"
    );
    for c in LITZ_CONSTRUCTIONS {
        let l = Litz::of(c.strands, c.strand_mm);
        let bundle = litz_bundle_for(&l, Insulation::Grade1);
        let area = f64::from(c.strands) * crate::engine::resistance::area_mm2(c.strand_mm);
        let _ = writeln!(
            o,
            "  {:<12} {:>8.4} {:>9.3} {:>8.3} {:>10.4}",
            format!("{}x{}", c.strands, c.strand_mm),
            area,
            bundle,
            bundle + l.serving(),
            litz_ohm_per_m(&l, 20.0)
        );
    }
}

/// The entries of `bobbins --json`, in the library's order.
fn bobbins_json(entries: &[BobbinEntry]) -> Vec<BobbinJson<'_>> {
    let list: Vec<_> = entries
        .iter()
        .map(|e| match &e.bobbin {
            Ok(b) => BobbinJson::Read {
                id: &e.id,
                origin: e.origin.label(),
                name: &b.name,
                window_width_mm: b.window.width_mm,
                window_height_mm: b.window.height_mm,
                ae_mm2: b.core.as_ref().map(|c| c.ae_mm2),
            },
            Err(err) => BobbinJson::Unreadable {
                id: &e.id,
                origin: e.origin.label(),
                error: err.to_string(),
            },
        })
        .collect();
    list
}

/// Where the user's own bobbins live, and whether there are any yet.
fn user_folder_line(o: &mut String, entries: &[BobbinEntry]) {
    match user_bobbin_dir() {
        Some(d) => {
            let note = if entries
                .iter()
                .any(|e| matches!(e.origin, BobbinOrigin::User(_)))
            {
                ""
            } else {
                " (none yet)"
            };
            let _ = writeln!(o, "\nyour bobbins: {}{note}", d.display());
        }
        None => {
            let _ = writeln!(
                o,
                "\nyour bobbins: no data directory on this system; set TURNSTACK_BOBBINS"
            );
        }
    }
}
