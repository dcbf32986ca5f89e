//! A first build from the requirements and chosen turns: one section per winding, wire
//! sized by current density, the primary side and the outputs apart by tape. The search
//! then chooses the wires, strands and order; this build only starts it.

use super::Turns;
use crate::engine::ac::skin_depth_m;
use crate::engine::resistance::{area_mm2, rho_ohm_m};
use crate::library::wires::metric_rows;
use crate::model::{
    Bobbin, BobbinSource, Build, Insulation, Requirements, Role, Section, Winding, WindingSection,
    WireSize,
};

/// Current density (A/mm^2 RMS) the first build's wires are sized for: the middle of the
/// 3-6 A/mm^2 natural-convection band of small transformers (common practice).
const FIRST_DENSITY_A_MM2: f64 = 4.5;

/// Most strands the first build parallels.
const FIRST_MAX_STRANDS: u32 = 4;

/// The names the design gives the windings: the primary, each output's secondary (the
/// output's name; "S" for the one-output shorthand) and the reset, never two alike.
pub fn winding_names(req: &Requirements) -> (String, Vec<String>, String) {
    let outputs: Vec<String> = if req.operating.outputs.is_empty() {
        vec!["S".to_string()]
    } else {
        req.operating
            .outputs
            .iter()
            .map(|o| o.winding.clone())
            .collect()
    };
    let free = |first: &str, second: &str| {
        if outputs.iter().any(|n| n == first) {
            second.to_string()
        } else {
            first.to_string()
        }
    };
    (free("P", "PRI"), outputs.clone(), free("R", "RST"))
}

fn winding(name: &str, role: Role, turns: u32) -> Winding {
    Winding {
        name: name.into(),
        role,
        turns,
        wire: WireSize::Metric { bare_mm: 0.3 },
        insulation: Insulation::Grade2,
        strands: 1,
        conductor: Default::default(),
        current_rms_a: None,
        start_pin: None,
        finish_pin: None,
    }
}

fn section(name: &str) -> Section {
    Section::Winding(WindingSection {
        winding: name.to_string(),
        turns: None,
        partner: None,
        layer_tape: 0,
        spread: false,
    })
}

/// The build for `turns` on `bobbin`: the requirements' setup, operating point (the switch's
/// rating as `switch_rating_v`) and material, one section per winding.
pub fn build_for(req: &Requirements, id: &str, bobbin: &Bobbin, turns: &Turns) -> Build {
    let (p, outputs, r) = winding_names(req);
    let mut windings = vec![winding(&p, Role::Primary, turns.np)];
    let mut stack = vec![section(&p), Section::Tape { wraps: 1 }];
    for (k, name) in outputs.iter().enumerate() {
        windings.push(winding(name, Role::Secondary, turns.outputs[k]));
        stack.push(section(name));
        stack.push(Section::Tape { wraps: 1 });
    }
    windings.push(winding(&r, Role::Reset, turns.nr));
    stack.push(section(&r));
    stack.push(Section::Tape { wraps: 1 });
    let mut operating = req.operating.clone();
    operating.switch_rating_v = Some(req.switch.voltage_rating_v);
    Build {
        title: if req.title.is_empty() {
            format!("Designed on {id}")
        } else {
            format!("{} (designed on {id})", req.title)
        },
        bobbin_source: BobbinSource::Id(id.to_string()),
        bobbin: bobbin.clone(),
        setup: req.setup.clone(),
        windings,
        stack,
        operating: Some(operating),
        material: Some(req.material.clone()),
        isolation: None,
        measured: None,
    }
}

/// Size each winding's wire for `FIRST_DENSITY_A_MM2` at its RMS current, in strands no
/// thicker than two skin depths (or the thickest row): the first build's wires.
pub fn size_wires(build: &mut Build, currents: &[Option<f64>], temperature_c: f64) {
    let f_hz = build.setup.frequency_khz.unwrap_or(100.0) * 1e3;
    let skin_mm = skin_depth_m(rho_ohm_m(temperature_c), f_hz) * 1e3;
    let rows = metric_rows();
    for (w, current) in build.windings.iter_mut().zip(currents) {
        let Some(i) = current.filter(|i| *i > 0.0) else {
            continue;
        };
        let need_mm2 = i / FIRST_DENSITY_A_MM2;
        let mut pick = None;
        for strands in 1..=FIRST_MAX_STRANDS {
            pick = rows
                .iter()
                .map(|r| r.nominal_mm)
                .filter(|d| *d >= 0.1 && *d <= (2.0 * skin_mm).max(0.2))
                .find(|d| f64::from(strands) * area_mm2(*d) >= need_mm2)
                .map(|d| (d, strands));
            if pick.is_some() {
                break;
            }
        }
        let (d, strands) = pick.unwrap_or((1.0, FIRST_MAX_STRANDS));
        w.wire = WireSize::Metric { bare_mm: d };
        w.strands = strands;
    }
}
