//! Winding capacitance: primary to secondary across the facing layers, and each winding's
//! self-capacitance by the layer energy method, with the ringing of the leakage against the
//! primary's.

use super::geometry::mlt_at_mm;
use super::layout::{Laid, LaidKind, Layer};
use crate::library::wires::ResolvedWire;
use crate::model::{Build, ResetSide, Role, Tube};

/// Permittivity of free space (F/m), CODATA 2018.
pub const EPS0_F_PER_M: f64 = 8.8541878128e-12;
/// Relative permittivity of polyester (PET) film tape, about 3.2 at 1 kHz-1 MHz (from memory:
/// PET film is usually quoted at 3.0-3.3).
pub const EPS_R_TAPE: f64 = 3.2;
/// Relative permittivity of the enamel, about 3.5 (from memory: polyurethane and
/// polyesterimide enamels are usually quoted at 3.5-4).
pub const EPS_R_ENAMEL: f64 = 3.5;

/// Capacitances of the wound part (pF) and the ringing they make with the leakage.
#[derive(Debug, Clone, PartialEq)]
pub struct CapacitanceEval {
    /// Sum over the faces where a primary-side section meets a secondary-side one.
    pub primary_secondary_pf: f64,
    /// Per winding (indexed like `build.windings`); `None` for a winding of one layer per
    /// section (the turn-to-turn capacitance is not modelled).
    pub self_pf: Vec<Option<f64>>,
    /// `1 / (2 pi sqrt(L_lk C_p))`: the P-S leakage against the primary's self-capacitance.
    pub ringing_khz: Option<f64>,
}

/// A parallel-plate capacitance (pF) of `area_m2` across layers of dielectric in series,
/// each `(thickness_m, eps_r)`.
pub fn plate_pf(area_m2: f64, layers: &[(f64, f64)]) -> f64 {
    let d_eff: f64 = layers.iter().map(|(t, e)| t / e).sum();
    if d_eff <= 0.0 || area_m2 <= 0.0 {
        return 0.0;
    }
    EPS0_F_PER_M * area_m2 / d_eff * 1e12
}

/// The layer energy method for a winding of `m` layers wound with the usual return at each
/// flange (Z winding): the voltage between adjacent layers runs from 0 at one flange to
/// `2 V/m` at the other, so each of the `m - 1` layer pairs stores `1/2 C_l (2V/m)^2 / 3`, and
/// `C = 4 (m - 1) / (3 m^2) C_l` (Dalessandro, da Silveira Cavalcante and Kolar, "Self-
/// capacitance of high-voltage transformers", IEEE Trans. Power Electronics 22(5), 2007).
pub fn z_winding_pf(layer_to_layer_pf: f64, m: usize) -> f64 {
    if m < 2 {
        return 0.0;
    }
    let m = m as f64;
    4.0 * (m - 1.0) / (3.0 * m * m) * layer_to_layer_pf
}

fn primary_side(role: Role, reset: ResetSide) -> Option<bool> {
    match role {
        Role::Primary => Some(true),
        Role::Reset => Some(reset == ResetSide::Primary),
        Role::Secondary => Some(false),
        Role::Auxiliary => None,
    }
}

/// Primary-secondary capacitance (parallel plates over the MLT at each face between the
/// two sides), each winding's self-capacitance (adjacent layers, Z winding) and the ringing
/// frequency, from the laid-out stack and the resolved wires.
pub fn evaluate(
    build: &Build,
    laid: &[Laid],
    wires: &[ResolvedWire],
    wound_breadth_mm: f64,
    leakage_ps_uh: Option<f64>,
) -> CapacitanceEval {
    let tube = &build.bobbin.tube;
    let mm = 1e-3;
    let b_w = wound_breadth_mm.max(0.0) * mm;
    let enamel = |k: usize| ((wires[k].od_mm - wires[k].bare_mm) / 2.0).max(0.0) * mm;
    let reset = build
        .operating
        .as_ref()
        .map_or(ResetSide::Primary, |o| o.reset_side);
    let n = build.windings.len();
    // Energy-weighted sum per winding: C_eq = sum C_sec (N_sec / N)^2; `None` until a
    // section of more than one layer adds to it.
    let mut self_pf: Vec<Option<f64>> = vec![None; n];
    let mut primary_secondary_pf = 0.0;
    // The last winding section: (winding, outer face y).
    let mut last: Option<(usize, f64)> = None;
    for l in laid {
        let LaidKind::Winding {
            winding: Some(k),
            partner,
            turns,
            layers,
            layer_tape,
            ..
        } = &l.kind
        else {
            continue;
        };
        let k = *k;
        if let Some((pk, top)) = last {
            let sides = (
                primary_side(build.windings[pk].role, reset),
                primary_side(build.windings[k].role, reset),
            );
            if matches!(sides, (Some(a), Some(b)) if a != b) {
                let gap = (l.y_mm - top).max(0.0) * mm;
                let area = mlt_at_mm(tube, 0.5 * (l.y_mm + top)) * mm * b_w;
                primary_secondary_pf += plate_pf(
                    area,
                    &[(gap, EPS_R_TAPE), (enamel(pk) + enamel(k), EPS_R_ENAMEL)],
                );
            }
        }
        last = Some((k, l.y_mm + l.height_mm));
        if layers.len() < 2 {
            continue;
        }
        let tape = f64::from(*layer_tape) * build.setup.tape_mm * mm;
        let c_sec = section_self_pf(tube, layers, tape, enamel(k), b_w);
        for i in [Some(k), *partner].into_iter().flatten() {
            let total = f64::from(build.windings[i].turns.max(1));
            let share = f64::from(*turns) / total;
            *self_pf[i].get_or_insert(0.0) += c_sec * share * share;
        }
    }
    let cp = build
        .windings
        .iter()
        .position(|w| w.role == Role::Primary)
        .and_then(|p| self_pf[p]);
    let ringing_khz = ringing_khz(leakage_ps_uh, cp);
    CapacitanceEval {
        primary_secondary_pf,
        self_pf,
        ringing_khz,
    }
}

/// The self-capacitance (pF) of one multi-layer section (Z winding): adjacent layers as
/// plates over the MLT at their face, with both films (`enamel_m` each, m) and the layer
/// tape (`tape_m`, m) between; `b_w` is the wound breadth (m).
fn section_self_pf(tube: &Tube, layers: &[Layer], tape_m: f64, enamel_m: f64, b_w: f64) -> f64 {
    let mm = 1e-3;
    // Adjacent layers: both films and the layer tape between, over the MLT at the face.
    let c_layers = layers.windows(2).map(|p| {
        let face = p[0].y_mm + p[0].height_mm;
        let area = mlt_at_mm(tube, face) * mm * b_w;
        plate_pf(
            area,
            &[(tape_m, EPS_R_TAPE), (2.0 * enamel_m, EPS_R_ENAMEL)],
        )
    });
    let c_l = c_layers.sum::<f64>() / layers.len().saturating_sub(1) as f64;
    z_winding_pf(c_l, layers.len())
}

/// The primary's ringing frequency (kHz) with the primary-secondary leakage (uH) and the
/// primary's self-capacitance (pF): 1 / (2 pi sqrt(L C)).
fn ringing_khz(leakage_ps_uh: Option<f64>, cp: Option<f64>) -> Option<f64> {
    match (leakage_ps_uh, cp) {
        (Some(l), Some(c)) if l > 0.0 && c > 0.0 => {
            Some(1.0 / (2.0 * std::f64::consts::PI * (l * 1e-6 * c * 1e-12).sqrt()) / 1e3)
        }
        _ => None,
    }
}
