//! The `capacitance` and `voltage_stress` objects of `check --json` (see `json.rs` for the
//! contract's rules: a key is a field; nothing is computed here).

use crate::engine::Evaluation;
use crate::model::Name;
use serde::Serialize;

/// The `capacitance` object.
#[derive(Debug, Serialize)]
pub struct CapacitanceJson<'a> {
    pub primary_secondary_pf: f64,
    pub ringing_khz: Option<f64>,
    pub self_pf: Vec<SelfCapacitanceJson<'a>>,
}

/// One winding's own capacitance (`null` where the layer method does not apply).
#[derive(Debug, Serialize)]
pub struct SelfCapacitanceJson<'a> {
    pub winding: &'a Name,
    pub pf: Option<f64>,
}

/// The `voltage_stress` object.
#[derive(Debug, Serialize)]
pub struct StressJson<'a> {
    pub volts_per_turn_v: f64,
    pub layers: Vec<LayerStressJson<'a>>,
    pub bifilar: Vec<PairStressJson<'a>>,
    pub between_sections: Vec<PairStressJson<'a>>,
}

/// The highest voltage between two adjacent layers of a section.
#[derive(Debug, Serialize)]
pub struct LayerStressJson<'a> {
    pub section: usize,
    pub winding: &'a Name,
    pub voltage_v: f64,
    pub limit_v: f64,
    pub layer_tape: u32,
}

/// The voltage across a bifilar pair or between two adjacent sections.
#[derive(Debug, Serialize)]
pub struct PairStressJson<'a> {
    pub inner_section: usize,
    pub outer_section: usize,
    pub inner: &'a Name,
    pub outer: &'a Name,
    pub voltage_v: f64,
    pub limit_v: f64,
    pub wraps: u32,
}

pub(super) fn capacitance(eval: &Evaluation) -> CapacitanceJson<'_> {
    let cap = &eval.capacitance;
    CapacitanceJson {
        primary_secondary_pf: cap.primary_secondary_pf,
        ringing_khz: cap.ringing_khz,
        self_pf: eval
            .windings
            .iter()
            .zip(&cap.self_pf)
            .map(|(w, pf)| SelfCapacitanceJson {
                winding: &w.name,
                pf: *pf,
            })
            .collect(),
    }
}

pub(super) fn stress(st: &crate::engine::stress::StressEval) -> StressJson<'_> {
    StressJson {
        volts_per_turn_v: st.volts_per_turn_v,
        layers: st
            .layers
            .iter()
            .map(|l| LayerStressJson {
                section: l.section,
                winding: &l.winding,
                voltage_v: l.voltage_v,
                limit_v: l.limit_v,
                layer_tape: l.layer_tape,
            })
            .collect(),
        bifilar: st.bifilar.iter().map(pair).collect(),
        between_sections: st.between_sections.iter().map(pair).collect(),
    }
}

fn pair(p: &crate::engine::stress::PairStress) -> PairStressJson<'_> {
    PairStressJson {
        inner_section: p.inner_section,
        outer_section: p.outer_section,
        inner: &p.inner,
        outer: &p.outer,
        voltage_v: p.voltage_v,
        limit_v: p.limit_v,
        wraps: p.wraps,
    }
}
