//! The `outputs` array of `check --json`: each output of a build with `[[output]]` tables.
//! Reads the Evaluation; computes nothing.

use crate::engine::OutputEval;
use serde::Serialize;

/// One entry of `outputs`, the regulated output first.
#[derive(Debug, Serialize)]
pub struct OutputJson<'a> {
    /// The secondary winding that feeds it.
    pub winding: &'a str,
    pub regulated: bool,
    pub turns: u32,
    /// The target voltage.
    pub vout_v: f64,
    pub iout_a: f64,
    pub rectifier_drop_v: f64,
    /// The voltage the turns make (the target itself for the regulated output).
    pub vout_from_turns_v: f64,
    pub error_v: f64,
    pub error_fraction: f64,
    /// The winding's RMS current; `null` when it has none.
    pub current_rms_a: Option<f64>,
}

/// Every output, or `None` for the one-output shorthand (the key is then left out).
pub fn outputs(list: &[OutputEval]) -> Option<Vec<OutputJson<'_>>> {
    (!list.is_empty()).then(|| {
        list.iter()
            .map(|o| OutputJson {
                winding: &o.winding,
                regulated: o.regulated,
                turns: o.turns,
                vout_v: o.vout_v,
                iout_a: o.iout_a,
                rectifier_drop_v: o.rectifier_drop_v,
                vout_from_turns_v: o.vout_from_turns_v,
                error_v: o.error_v,
                error_fraction: o.error_fraction,
                current_rms_a: o.current_rms_a,
            })
            .collect()
    })
}
