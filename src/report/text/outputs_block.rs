//! The outputs of a converter with `[[output]]` tables: each output's target, the voltage
//! its turns make, the error and the currents.

use super::*;
use crate::engine::OutputEval;

/// One line per output, the regulated one first; nothing for the one-output shorthand.
pub(super) fn outputs_block(o: &mut String, outputs: &[OutputEval]) {
    if outputs.is_empty() {
        return;
    }
    let _ = writeln!(
        o,
        "\nOutputs (the first regulated; the others as the turns make them, ideal CCM)"
    );
    let _ = writeln!(
        o,
        "  winding  turns  target V  from turns V  error       I out A  I rms A  drop V"
    );
    for out in outputs {
        let error = if out.regulated {
            "regulated".to_string()
        } else {
            format!("{:+.2} %", out.error_fraction * 100.0)
        };
        let rms = out
            .current_rms_a
            .map_or("-".to_string(), |i| format!("{i:.3}"));
        let _ = writeln!(
            o,
            "  {:<7} {:>6}  {:>8.2}  {:>12.2}  {:<10} {:>8.3}  {:>7}  {:>6.2}",
            truncate(&out.winding, 7),
            out.turns,
            out.vout_v,
            out.vout_from_turns_v,
            error,
            out.iout_a,
            rms,
            out.rectifier_drop_v
        );
    }
}
