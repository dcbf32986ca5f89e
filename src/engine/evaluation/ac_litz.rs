//! The AC factors of litz windings (`engine::litz`, Sullivan 1999) from the MMF the layer
//! sums collected, and the warnings when litz stops paying.

use super::ac_figures::AcSums;
use super::*;

/// A litz winding whose AC factor passes this loses more to proximity than to DC: more
/// strands of that size no longer lower the loss (Sullivan 1999: the optimum lies below).
pub const LITZ_FACTOR_LIMIT: f64 = 2.0;

/// Each litz winding's AC factors by `engine::litz`, in place of the resistive layers
/// `ac_figures` summed for it; its `strand_over_skin`; and the litz warnings.
pub(super) fn litz_factors(
    build: &Build,
    windings: &mut [WindingEval],
    sums: &[AcSums],
    memo: &mut Memo,
    (delta_mm, b_w): (f64, f64),
    warnings: &mut Vec<Warning>,
) {
    for (k, w) in build.windings.iter().enumerate() {
        let (Conductor::Litz(l), sum) = (w.conductor, &sums[k]) else {
            continue;
        };
        let ev = &mut windings[k];
        if sum.skip || sum.length <= 0.0 || ev.ac.is_none() {
            continue;
        }
        let geometry = litz::LitzGeometry {
            strand_mm: l.strand_mm,
            strands_per_bundle: f64::from(l.strands),
            strands_per_turn: f64::from(l.strands) * f64::from(w.strands.max(1)),
            bundle_mm: conductor::litz_bundle_mm(&l, w),
            breadth_mm: b_w,
        };
        let g = litz::g_coefficient(&geometry, sum.f2 / sum.length);
        let x = l.strand_mm / delta_mm;
        let ac_factor = litz::factor(g, x);
        let ac_factor_waveform = sum.spectrum.map(|(si, _, _)| {
            harmonics::waveform_factor(memo.spectrum_of(si), |n| {
                litz::factor(g, x * (n as f64).sqrt())
            })
        });
        if let conductor::ConductorFigures::Litz {
            strand_over_skin, ..
        } = &mut ev.conductor
        {
            *strand_over_skin = Some(x);
        }
        let dcr = ev.dcr_ohm;
        ev.ac = Some(AcFigures {
            skin_depth_mm: delta_mm,
            ac_factor,
            rac_ohm: ac_factor * dcr,
            ac_factor_waveform,
            rac_waveform_ohm: ac_factor_waveform.map(|f| f * dcr),
        });
        let kind = if x > 1.0 {
            WarningKind::LitzStrandThick {
                winding: ev.name.clone(),
                strand_mm: l.strand_mm,
                skin_depth_mm: delta_mm,
            }
        } else if ac_factor > LITZ_FACTOR_LIMIT {
            WarningKind::LitzTooManyStrands {
                winding: ev.name.clone(),
                strands: l.strands,
                ac_factor,
            }
        } else {
            continue;
        };
        warnings.push(Warning {
            at: WarningAt::Winding(k),
            kind,
        });
    }
}
