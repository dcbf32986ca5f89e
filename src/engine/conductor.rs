//! The figures of a winding's conductor, whatever its kind: the diameters the layout lays,
//! the pitch of one turn across the breadth, the copper section, the resistance per metre,
//! and the checks that refuse a foil or litz that cannot be wound. Round wire goes through
//! exactly the formulas it always had.

use super::resistance::{area_mm2, rho_ohm_m};
use super::validate::Place;
use crate::engine::constants::MM2;
use crate::library::wires::{self, ResolvedWire};
use crate::model::{
    Build, Conductor, FOIL_MAX_MM, FOIL_MIN_MM, Foil, Insulation, LITZ_STRAND_MM, LITZ_STRANDS,
    Litz, Winding,
};

/// Interleaf film thinner than this is refused (a 6 um film is the thinnest sold, common
/// practice): foil turns without film between them short.
pub const INTERLEAF_MIN_MM: f64 = 0.006;
/// Packing factors a litz bundle may be given: up to hexagonal close packing of circles
/// (pi / (2 sqrt 3) = 0.9069), and not so loose that it is no longer a bundle.
pub const PACKING_RANGE: std::ops::RangeInclusive<f64> = 0.4..=0.9069;
/// Lay factors accepted: a strand is never shorter than its bundle, nor 20 % longer.
pub const LAY_RANGE: std::ops::RangeInclusive<f64> = 1.0..=1.2;

/// Overall diameter of a litz strand: the wire table's overall diameter of a round wire of
/// `strand_mm` in the winding's enamel grade (IEC 60317-0-1 rows; the rule between them).
pub fn litz_strand_od_mm(l: &Litz, w: &Winding) -> f64 {
    wires::overall_mm(l.strand_mm, w.insulation)
}

/// Bundle diameter under the serving: `D = d_o sqrt(n / p)`, `p` the packing factor (the
/// strands' overall area over the bundle's circle).
pub fn litz_bundle_mm(l: &Litz, w: &Winding) -> f64 {
    litz_bundle_for(l, w.insulation)
}

/// [`litz_bundle_mm`] for strands of enamel `insulation`.
pub fn litz_bundle_for(l: &Litz, insulation: Insulation) -> f64 {
    wires::overall_mm(l.strand_mm, insulation) * (f64::from(l.strands) / l.packing_factor()).sqrt()
}

/// Resistance per metre (ohm/m) of one litz bundle at `temperature_c`, with its lay factor.
pub fn litz_ohm_per_m(l: &Litz, temperature_c: f64) -> f64 {
    rho_ohm_m(temperature_c) * l.lay() / (f64::from(l.strands) * area_mm2(l.strand_mm) * MM2)
}

/// The diameters the layout works with. Round: the wire table (`wires::resolve`). Foil:
/// `bare_mm` = thickness, `od_mm` = thickness + interleaf (the layer height). Litz:
/// `bare_mm` = the strand's, `od_mm` = bundle + serving.
pub fn resolve(w: &Winding) -> ResolvedWire {
    match w.conductor {
        Conductor::Round => wires::resolve(&w.wire, w.insulation),
        Conductor::Foil(f) => ResolvedWire {
            bare_mm: f.thickness_mm,
            od_mm: f.thickness_mm + f.interleaf(),
        },
        Conductor::Litz(l) => ResolvedWire {
            bare_mm: l.strand_mm,
            od_mm: litz_bundle_mm(&l, w) + l.serving(),
        },
    }
}

/// Width one turn takes across the breadth: `strands x od` for round wire and litz bundles;
/// the whole wound breadth `breadth_mm` for foil (one turn a layer).
pub fn pitch_mm(w: &Winding, wire: &ResolvedWire, breadth_mm: f64) -> f64 {
    match w.conductor {
        Conductor::Foil(_) => breadth_mm,
        _ => f64::from(w.strands.max(1)) * wire.od_mm,
    }
}

/// Copper section of one turn (mm^2). Round: `strands x pi d^2 / 4`. Foil: thickness x
/// width. Litz: `bundles x n x pi d_s^2 / 4`.
pub fn copper_area_mm2(w: &Winding, wire: &ResolvedWire, breadth_mm: f64) -> f64 {
    match w.conductor {
        Conductor::Round => f64::from(w.strands) * area_mm2(wire.bare_mm),
        Conductor::Foil(f) => f.thickness_mm * f.width_on(breadth_mm).max(0.0),
        Conductor::Litz(l) => f64::from(w.strands) * f64::from(l.strands) * area_mm2(l.strand_mm),
    }
}

/// Resistance per metre of the winding (ohm/m): `rho(T) / A`, times the lay factor for litz
/// (its strands are longer than the bundle).
pub fn ohm_per_m(w: &Winding, wire: &ResolvedWire, breadth_mm: f64, temperature_c: f64) -> f64 {
    if w.conductor == Conductor::Round {
        return super::resistance::ohm_per_m(wire.bare_mm, w.strands, temperature_c);
    }
    let a = copper_area_mm2(w, wire, breadth_mm).max(f64::MIN_POSITIVE) * MM2;
    let lay = match w.conductor {
        Conductor::Litz(l) => l.lay(),
        _ => 1.0,
    };
    rho_ohm_m(temperature_c) * lay / a
}

/// Refuse a foil or litz winding that cannot be wound: a foil thinner than [`FOIL_MIN_MM`]
/// or thicker than [`FOIL_MAX_MM`], wider than the wound breadth, with too thin an
/// interleaf, or whose turns would not fit the window's height; a litz with a strand count
/// or diameter out of range or figures that make no sense.
pub fn check(
    i: usize,
    w: &Winding,
    breadth_mm: f64,
    window_height_mm: f64,
    bad: &mut dyn FnMut(Place, String),
) {
    match &w.conductor {
        Conductor::Round => {}
        Conductor::Foil(f) => check_foil(i, w, f, breadth_mm, window_height_mm, bad),
        Conductor::Litz(l) => check_litz(i, l, bad),
    }
}

/// Refuse stack section `i` when it winds a foil bifilar (`a` with `c`); true when refused.
pub fn refuse_bifilar_foil(
    build: &Build,
    i: usize,
    a: usize,
    c: Option<usize>,
    bad: &mut dyn FnMut(Place, String),
) -> bool {
    let Some(c) = c else { return false };
    let foil = [a, c]
        .iter()
        .any(|&k| matches!(build.windings[k].conductor, Conductor::Foil(_)));
    if foil {
        bad(
            Place::Section(i, "with"),
            "a foil winding cannot be wound bifilar; interleave it as its own sections".into(),
        );
    }
    foil
}

fn check_foil(
    i: usize,
    w: &Winding,
    f: &Foil,
    breadth_mm: f64,
    window_height_mm: f64,
    bad: &mut dyn FnMut(Place, String),
) {
    let mut say = |m: String| bad(Place::Winding(i, "wire"), m);
    let t = f.thickness_mm;
    if !(FOIL_MIN_MM..=FOIL_MAX_MM).contains(&t) {
        say(format!(
            "foil_mm must be from {FOIL_MIN_MM} mm (thinner tears when wound by hand) to {FOIL_MAX_MM} mm, got {t}"
        ));
        return;
    }
    let width = f.width_on(breadth_mm);
    if !(width.is_finite() && width > 0.0) {
        say(match f.width_mm {
            Some(_) => format!("width_mm must be positive, got {width}"),
            None => format!(
                "the wound breadth ({breadth_mm:.2} mm) leaves no foil width after the {} mm overhang each side; give width_mm",
                f.overhang()
            ),
        });
    } else if width > breadth_mm + 1e-9 {
        say(format!(
            "foil {width} mm wide is wider than the wound breadth, {breadth_mm:.2} mm between the margins"
        ));
    }
    let interleaf = f.interleaf();
    if !(interleaf.is_finite() && (INTERLEAF_MIN_MM..=1.0).contains(&interleaf)) {
        say(format!(
            "interleaf_mm must be from {INTERLEAF_MIN_MM} to 1 mm (film between the turns), got {interleaf}"
        ));
    }
    for (key, v) in [("overhang_mm", f.overhang()), ("tab_mm", f.tab())] {
        if !(v.is_finite() && v >= 0.0) {
            say(format!("{key} must be zero or positive, got {v}"));
        }
    }
    if w.strands != 1 {
        bad(
            Place::Winding(i, "strands"),
            "does not apply to foil (one foil a turn); leave it out".into(),
        );
    }
    let height = f64::from(w.turns) * (t + interleaf);
    if window_height_mm > 0.0 && height > window_height_mm + 1e-9 {
        bad(
            Place::Winding(i, "turns"),
            format!(
                "{} foil turns of {t} mm + {interleaf} mm interleaf need {height:.2} mm of height; the window has {window_height_mm:.2} mm",
                w.turns
            ),
        );
    }
}

fn check_litz(i: usize, l: &Litz, bad: &mut dyn FnMut(Place, String)) {
    let mut say = |m: String| bad(Place::Winding(i, "wire"), m);
    if !LITZ_STRANDS.contains(&l.strands) {
        say(format!(
            "litz_strands must be from {} to {}, got {}",
            LITZ_STRANDS.start(),
            LITZ_STRANDS.end(),
            l.strands
        ));
    }
    if !LITZ_STRAND_MM.contains(&l.strand_mm) {
        say(format!(
            "strand_mm must be from {} to {} mm, got {}",
            LITZ_STRAND_MM.start(),
            LITZ_STRAND_MM.end(),
            l.strand_mm
        ));
    }
    if !PACKING_RANGE.contains(&l.packing_factor()) {
        say(format!(
            "packing must be from {} to {} (close-packed circles), got {}",
            PACKING_RANGE.start(),
            PACKING_RANGE.end(),
            l.packing_factor()
        ));
    }
    if !(l.serving().is_finite() && (0.0..=1.0).contains(&l.serving())) {
        say(format!(
            "serving_mm must be from 0 to 1 mm, got {}",
            l.serving()
        ));
    }
    if !LAY_RANGE.contains(&l.lay()) {
        say(format!(
            "lay_factor must be from {} to {}, got {}",
            LAY_RANGE.start(),
            LAY_RANGE.end(),
            l.lay()
        ));
    }
}

/// A winding's conductor figures as the reports state them (see FORMAT.md, "Foil and litz").
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ConductorFigures {
    /// Round magnet wire: its figures are the winding's `bare_mm`, `od_mm`, `strands`.
    Round,
    /// Foil: thickness, the width used, the interleaf, the layer height (`foil + interleaf`)
    /// and Dowell's porosity `width / wound breadth`.
    Foil {
        /// Foil thickness (mm).
        thickness_mm: f64,
        /// Foil width used (mm).
        width_mm: f64,
        /// Interleaf under each turn (mm).
        interleaf_mm: f64,
        /// `foil + interleaf` (mm).
        layer_height_mm: f64,
        /// Dowell's porosity: foil width over the wound breadth.
        porosity: f64,
    },
    /// Litz: strands, strand bare and overall diameter, bundle under the serving, overall
    /// diameter, the packing and lay factors used; with a frequency, the strand's diameter
    /// over the skin depth (set by the AC figures).
    Litz {
        /// Strands in the bundle.
        strands: u32,
        /// Strand bare diameter (mm).
        strand_mm: f64,
        /// Strand overall diameter, enamel included (mm).
        strand_od_mm: f64,
        /// Bundle diameter under the serving (mm).
        bundle_mm: f64,
        /// Overall diameter over the serving (mm).
        od_mm: f64,
        /// Packing factor used.
        packing: f64,
        /// Lay-length factor on the DC resistance.
        lay_factor: f64,
        /// Strand diameter over the skin depth, with a frequency.
        strand_over_skin: Option<f64>,
    },
}

impl ConductorFigures {
    /// `round`, `foil` or `litz`.
    pub fn kind_key(&self) -> &'static str {
        match self {
            ConductorFigures::Round => "round",
            ConductorFigures::Foil { .. } => "foil",
            ConductorFigures::Litz { .. } => "litz",
        }
    }
}

/// The figures of a winding's conductor on a wound breadth of `breadth_mm`.
pub fn figures(w: &Winding, wire: &ResolvedWire, breadth_mm: f64) -> ConductorFigures {
    match w.conductor {
        Conductor::Round => ConductorFigures::Round,
        Conductor::Foil(f) => {
            let width = f.width_on(breadth_mm);
            ConductorFigures::Foil {
                thickness_mm: f.thickness_mm,
                width_mm: width,
                interleaf_mm: f.interleaf(),
                layer_height_mm: wire.od_mm,
                porosity: if breadth_mm > 0.0 {
                    (width / breadth_mm).clamp(0.0, 1.0)
                } else {
                    0.0
                },
            }
        }
        Conductor::Litz(l) => ConductorFigures::Litz {
            strands: l.strands,
            strand_mm: l.strand_mm,
            strand_od_mm: litz_strand_od_mm(&l, w),
            bundle_mm: litz_bundle_mm(&l, w),
            od_mm: wire.od_mm,
            packing: l.packing_factor(),
            lay_factor: l.lay(),
            strand_over_skin: None,
        },
    }
}
