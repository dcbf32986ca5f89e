//! The sections of the stack and the leakage between the winding pairs.

use super::*;

/// A winding's length: every layer it appears in, as `winding` or as the bifilar `partner`.
pub(super) fn winding_length_mm(laid: &[Laid], k: usize) -> f64 {
    let mut length_mm = 0.0;
    for l in laid {
        if let LaidKind::Winding {
            winding,
            partner,
            layers,
            ..
        } = &l.kind
        {
            // Twice for a section bifilar with itself (refused by validation), as a pair.
            let times = usize::from(*winding == Some(k)) + usize::from(*partner == Some(k));
            for _ in 0..times {
                length_mm += layers
                    .iter()
                    .map(|ly| f64::from(ly.turns) * ly.mlt_mm)
                    .sum::<f64>();
            }
        }
    }
    length_mm
}

pub(super) fn section_eval(build: &Build, l: Laid, window_height_mm: f64) -> SectionEval {
    let past_window = l.y_mm + l.height_mm > window_height_mm + FIT_TOLERANCE_MM;
    match l.kind {
        LaidKind::Tape { wraps } => SectionEval {
            kind: SectionKind::Tape { wraps },
            y_mm: l.y_mm,
            height_mm: l.height_mm,
            layers: Vec::new(),
            past_window,
        },
        LaidKind::Winding {
            winding,
            partner,
            turns,
            pitch_mm,
            turns_per_layer,
            layer_height_mm,
            layer_tape,
            spread,
            layers,
        } => {
            let name = |i: Option<usize>| i.map(|i| build.windings[i].name.clone());
            let weighted: f64 = layers
                .iter()
                .map(|ly| f64::from(ly.turns) * ly.mlt_mm)
                .sum();
            SectionEval {
                kind: SectionKind::Winding {
                    winding: name(winding).unwrap_or_default(),
                    partner: name(partner),
                    turns,
                    pitch_mm,
                    turns_per_layer,
                    layer_count: layers.len() as u32,
                    last_layer_turns: layers.last().map_or(0, |ly| ly.turns),
                    layer_height_mm,
                    layer_tape,
                    spread,
                    mlt_mm: if turns > 0 {
                        weighted / f64::from(turns)
                    } else {
                        0.0
                    },
                },
                y_mm: l.y_mm,
                height_mm: l.height_mm,
                // The same size as a laid layer, so this reuses the laid list's memory.
                layers: layers
                    .into_iter()
                    .map(|ly| LayerEval {
                        y_mm: ly.y_mm,
                        height_mm: ly.height_mm,
                        turns: ly.turns,
                        mlt_mm: ly.mlt_mm,
                        partial: ly.turns < turns_per_layer,
                    })
                    .collect(),
                past_window,
            }
        }
    }
}

/// The leakage between the first primary and the first secondary (uH, referred to the primary).
pub(super) fn first_ps_leakage(build: &Build, leakage: &[LeakageEval]) -> Option<f64> {
    let p = build.first_of(Role::Primary)?;
    let s = build.first_of(Role::Secondary)?;
    leakage
        .iter()
        .find(|l| l.from == p.name && l.to == s.name)
        .map(|l| l.uh)
}

/// Every primary-secondary and primary-reset pair, referred to the primary.
pub(super) fn leakage_pairs(
    build: &Build,
    laid: &[Laid],
    wires: &[crate::library::wires::ResolvedWire],
) -> Vec<LeakageEval> {
    let count = |role: Role| build.windings.iter().filter(|w| w.role == role).count();
    let mut out =
        Vec::with_capacity(count(Role::Primary) * (count(Role::Secondary) + count(Role::Reset)));
    for (pi, p) in build
        .windings
        .iter()
        .enumerate()
        .filter(|(_, w)| w.role == Role::Primary)
    {
        for role in [Role::Secondary, Role::Reset] {
            for (oi, o) in build
                .windings
                .iter()
                .enumerate()
                .filter(|(_, w)| w.role == role)
            {
                let l_h = leakage::leakage_h(
                    laid,
                    &build.bobbin.tube,
                    layout::usable_width_mm(build),
                    build.windings.len(),
                    (pi, p.turns),
                    (oi, o.turns),
                );
                // Wound bifilar, the two share their layers: the field between neighbouring
                // wires along the layer is what is left (engine::leakage).
                let bifilar = leakage::bifilar_leakage_h(laid, pi, oi, |k| {
                    let w = &build.windings[k];
                    let strands = f64::from(w.strands.max(1));
                    (
                        0.5 * wires[k].bare_mm * strands.sqrt(),
                        strands * wires[k].od_mm,
                    )
                });
                out.push(LeakageEval {
                    from: p.name.clone(),
                    to: o.name.clone(),
                    referred_to: p.name.clone(),
                    uh: (l_h + bifilar) * 1e6,
                    bifilar_uh: bifilar * 1e6,
                });
            }
        }
    }
    out
}
