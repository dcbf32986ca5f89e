//! The readable report of `turnstack check`: the stack from the tube outward with its layers,
//! the windings, leakage, converter figures, the verdict and the warnings, in 80 columns.

pub use super::textfmt::{truncate, wire_label};
use super::wrap;
use crate::engine::{
    AlSource, ConverterEval, CurrentSource, Evaluation, Limit, LossEval, SectionKind,
    TemperatureSource, WarningAt,
};
use crate::model::{BobbinSource, Build, ResetSide, Tube};
use std::fmt::Write as _;

pub const WIDTH: usize = 80;

/// One line verdict: "FITS ..." or "DOES NOT FIT ...".
pub fn verdict(eval: &Evaluation) -> String {
    if eval.fits {
        format!(
            "FITS: {:.2} mm with allowance of {:.2} mm window height, {:.2} mm spare",
            eval.height_with_allowance_mm, eval.window_height_mm, eval.spare_height_mm
        )
    } else {
        format!(
            "DOES NOT FIT: {:.2} mm with allowance of {:.2} mm window height, {:.2} mm too tall",
            eval.height_with_allowance_mm, eval.window_height_mm, -eval.spare_height_mm
        )
    }
}

/// A temperature as the report prints it: as given when whole, else to 0.1 C.
fn temperature_figure(t: f64) -> String {
    if t.fract() == 0.0 {
        format!("{t}")
    } else {
        format!("{t:.1}")
    }
}

/// Where the winding temperature came from, when it was not given.
fn temperature_how(eval: &Evaluation) -> String {
    match (eval.temperature_source, &eval.losses) {
        (TemperatureSource::AmbientPlusRise, Some(l)) => format!(
            " (ambient {} C + predicted rise)",
            temperature_figure(l.ambient_c)
        ),
        (TemperatureSource::Ambient, _) => " (ambient, no rise predicted)".into(),
        (TemperatureSource::Default, _) => " (default)".into(),
        _ => String::new(),
    }
}

/// The last line of the report: whether the design passes, and if not what fails.
pub fn outcome(eval: &Evaluation) -> String {
    let failures = eval.failures();
    if failures.is_empty() {
        return "PASSES: the build fits and every limit holds".into();
    }
    let what: Vec<String> = failures
        .iter()
        .map(|c| match eval.limits.iter().find(|l| l.constraint == *c) {
            Some(l) => format!(
                "{} ({} against {})",
                c.key(),
                limit_figure(l, l.used),
                limit_figure(l, l.allowed)
            ),
            None => c.key().to_string(),
        })
        .collect();
    format!("FAILS: {}", what.join(", "))
}

pub fn bobbin_line(build: &Build) -> String {
    let b = &build.bobbin;
    let id = match &build.bobbin_source {
        BobbinSource::Id(id) => id.clone(),
        BobbinSource::Inline => "inline".into(),
    };
    let tube = match b.tube {
        Tube::Rect {
            width_mm,
            depth_mm,
            corner_radius_mm,
        } => {
            format!("tube {width_mm:.2} x {depth_mm:.2} mm r {corner_radius_mm:.2}")
        }
        Tube::Round { diameter_mm } => format!("tube dia {diameter_mm:.2} mm"),
    };
    format!(
        "bobbin {id}: window {:.2} x {:.2} mm, {tube}",
        b.window.width_mm, b.window.height_mm
    )
}

pub fn render(build: &Build, eval: &Evaluation) -> String {
    let mut o = String::new();
    header_block(&mut o, build, eval);
    stack_block(&mut o, eval);
    windings_block(&mut o, build, eval);
    capacitance_block(&mut o, eval);
    currents_block(&mut o, eval);
    if let Some(c) = &eval.converter {
        converter_block(&mut o, c);
    }
    if let Some(st) = &eval.stress {
        stress_block(&mut o, st);
    }
    if let Some(l) = &eval.losses {
        losses_block(&mut o, l);
    }
    limits_block(&mut o, eval);
    remarks_block(&mut o, build, eval);
    o
}

/// The title, the bobbin, the setup, the verdict and the summary of heights.
fn header_block(o: &mut String, build: &Build, eval: &Evaluation) {
    let title = if build.title.is_empty() {
        "(untitled build)"
    } else {
        &build.title
    };
    for l in wrap(title, WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    for l in wrap(&bobbin_line(build), WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    if !build.bobbin.name.is_empty() {
        for l in wrap(&format!("  {}", build.bobbin.name), WIDTH, "  ") {
            let _ = writeln!(o, "{l}");
        }
    }
    let s = &build.setup;
    let freq = frequency_text(build);
    let setup = format!(
        "setup: {} C{}, allowance x{:.2}, margins {:.2} mm, tape {:.3} mm/wrap, {freq}",
        temperature_figure(eval.temperature_c),
        temperature_how(eval),
        s.bulge,
        s.margin_mm,
        s.tape_mm
    );
    for l in wrap(&setup, WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    let _ = writeln!(o);
    for l in wrap(&verdict(eval), WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
    let summary = format!(
        "build {:.3} mm, x{:.2} = {:.3} mm; usable width {:.2} mm; fill factor {:.3}",
        eval.build_height_mm,
        s.bulge,
        eval.height_with_allowance_mm,
        eval.usable_width_mm,
        eval.fill_factor
    );
    for l in wrap(&summary, WIDTH - 2, "  ") {
        let _ = writeln!(o, "  {l}");
    }
}

/// The stack from the tube outward, one row per section.
fn stack_block(o: &mut String, eval: &Evaluation) {
    let _ = writeln!(o, "\nStack, from the tube outward");
    let _ = writeln!(
        o,
        "  #  section        turns  /layer  layers  last  height mm  MLT mm"
    );
    for (i, sec) in eval.sections.iter().enumerate() {
        let flag = if sec.past_window { "  PAST LIMIT" } else { "" };
        match &sec.kind {
            SectionKind::Tape { wraps } => {
                let _ = writeln!(
                    o,
                    "{:>3}  tape x{:<9}{:>38.3}{flag}",
                    i + 1,
                    wraps,
                    sec.height_mm
                );
            }
            SectionKind::Winding {
                winding,
                with,
                turns,
                turns_per_layer,
                layer_count,
                last_layer_turns,
                layer_tape,
                mlt_mm,
                ..
            } => {
                let name = match with {
                    Some(w) => format!("{winding}+{w} bifilar"),
                    None => winding.to_string(),
                };
                let _ = writeln!(
                    o,
                    "{:>3}  {:<14} {:>5}  {:>6}  {:>6}  {:>4}  {:>9.3}  {:>6.1}{flag}",
                    i + 1,
                    truncate(&name, 14),
                    turns,
                    turns_per_layer,
                    layer_count,
                    last_layer_turns,
                    sec.height_mm,
                    mlt_mm
                );
                for (k, layer) in sec.layers.iter().enumerate() {
                    let partial = if layer.partial { "  partial" } else { "" };
                    let _ = writeln!(
                        o,
                        "       layer {:<3} {:>4} turns at {:>6.3} mm, MLT {:>5.1} mm{partial}",
                        k + 1,
                        layer.turns,
                        layer.y_mm,
                        layer.mlt_mm
                    );
                }
                if *layer_tape > 0 {
                    let _ = writeln!(o, "       {layer_tape} wrap(s) of tape between layers");
                }
            }
        }
    }
}

/// The switching frequency as the report writes it.
fn frequency_text(build: &Build) -> String {
    build
        .setup
        .frequency_khz
        .map_or("no frequency".to_string(), |f| format!("{f} kHz"))
}

/// The windings with their resistance, the AC figures and the leakage.
fn windings_block(o: &mut String, build: &Build, eval: &Evaluation) {
    let freq = frequency_text(build);
    let _ = writeln!(
        o,
        "\nWindings, resistance at {} C",
        temperature_figure(eval.temperature_c)
    );
    let _ = writeln!(
        o,
        "  name   role       turns  wire             length m  MLT mm   DCR ohm  A/mm2"
    );
    for (w, model) in eval.windings.iter().zip(&build.windings) {
        let wire = wire_label(&model.wire, w.strands);
        let j = w
            .current_density_a_mm2
            .map_or("-".to_string(), |j| format!("{j:.1}"));
        let _ = writeln!(
            o,
            "  {:<6} {:<9} {:>6}  {:<15} {:>9.3}  {:>6.1}  {:>8.4}  {:>5}",
            truncate(&w.name, 6),
            w.role.key(),
            w.turns,
            truncate(&wire, 15),
            w.length_m,
            w.mlt_mm,
            w.dcr_ohm,
            j
        );
    }
    if let Some(a) = eval.windings.iter().find_map(|w| w.ac.as_ref()) {
        let _ = writeln!(
            o,
            "\nAC resistance at {freq} (Dowell, sinusoidal), skin depth {:.3} mm",
            a.skin_depth_mm
        );
        for w in &eval.windings {
            match &w.ac {
                Some(a) => {
                    let _ = writeln!(
                        o,
                        "  {:<6} AC factor {:>6.2}   Rac {:>8.4} ohm",
                        truncate(&w.name, 6),
                        a.ac_factor,
                        a.rac_ohm
                    );
                }
                None => {
                    let _ = writeln!(
                        o,
                        "  {:<6} no AC figure (see warnings)",
                        truncate(&w.name, 6)
                    );
                }
            }
        }
    }

    if !eval.leakage.is_empty() {
        let _ = writeln!(o, "\nLeakage inductance (1-D field across the build)");
        for l in &eval.leakage {
            let bifilar = if l.bifilar_uh > 0.0 {
                format!(" ({:.3} uH of it between the bifilar wires)", l.bifilar_uh)
            } else {
                String::new()
            };
            let line = format!(
                "{} - {}: {:.3} uH referred to {}{bifilar}",
                l.from, l.to, l.uh, l.referred_to
            );
            for l in wrap(&line, WIDTH - 2, "    ") {
                let _ = writeln!(o, "  {l}");
            }
        }
    }
}

/// The warnings and the notes.
fn remarks_block(o: &mut String, build: &Build, eval: &Evaluation) {
    let _ = writeln!(o, "\nWarnings");
    if eval.warnings.is_empty() {
        let _ = writeln!(o, "  none");
    }
    for w in &eval.warnings {
        let at = match w.at {
            WarningAt::Section(i) => format!(" [stack #{}]", i + 1),
            WarningAt::Winding(i) => {
                format!(" [{}]", build.windings.get(i).map_or("?", |w| &w.name))
            }
            _ => String::new(),
        };
        for l in wrap(
            &format!("! {}{at}: {}", w.code(), w.message()),
            WIDTH - 2,
            "    ",
        ) {
            let _ = writeln!(o, "  {l}");
        }
    }
    for n in &eval.notes {
        for l in wrap(&format!("note: {n}"), WIDTH - 2, "    ") {
            let _ = writeln!(o, "  {l}");
        }
    }
    let _ = writeln!(o);
    for l in wrap(&outcome(eval), WIDTH, "  ") {
        let _ = writeln!(o, "{l}");
    }
}

fn currents_block(o: &mut String, eval: &Evaluation) {
    if eval.windings.iter().all(|w| w.current_rms_a.is_none()) {
        return;
    }
    let _ = writeln!(
        o,
        "\nCurrents and copper loss (RMS; AC factor over the waveform's harmonics)"
    );
    let _ = writeln!(
        o,
        "  name    I rms A  from       model A  AC factor   Rac ohm    loss W"
    );
    for w in &eval.windings {
        let Some(i) = w.current_rms_a else {
            let _ = writeln!(o, "  {:<6}  no current given", truncate(&w.name, 6));
            continue;
        };
        let from = match w.current_source {
            Some(CurrentSource::Given) => "given",
            _ => "op. point",
        };
        let model = w
            .current_model_rms_a
            .map_or("-".to_string(), |m| format!("{m:.3}"));
        let (fac, rac) = match &w.ac {
            Some(a) => match (a.ac_factor_waveform, a.rac_waveform_ohm) {
                (Some(f), Some(r)) => (format!("{f:.2}"), format!("{r:.4}")),
                _ => (
                    format!("{:.2} sin", a.ac_factor),
                    format!("{:.4}", a.rac_ohm),
                ),
            },
            None => ("DC".to_string(), format!("{:.4}", w.dcr_ohm)),
        };
        let loss = w
            .copper_loss_w
            .map_or("-".to_string(), |l| format!("{l:.3}"));
        let _ = writeln!(
            o,
            "  {:<6} {:>8.3}  {:<9} {:>8}  {:>9}  {:>8}  {:>8}",
            truncate(&w.name, 6),
            i,
            from,
            model,
            fac,
            rac,
            loss
        );
    }
    let band = crate::engine::limits::CURRENT_DENSITY_BAND_A_MM2;
    for w in &eval.windings {
        if let Some(p) = w.proximity_loss_w {
            let line = format!(
                "{}: {p:.3} W of its loss from the field of the others (proximity)",
                w.name
            );
            for l in wrap(&line, WIDTH - 2, "    ") {
                let _ = writeln!(o, "  {l}");
            }
        }
    }
    let _ = writeln!(
        o,
        "  current density band {:.0}-{:.0} A/mm2 RMS (common practice, natural convection)",
        band.0, band.1
    );
}

fn converter_block(o: &mut String, c: &ConverterEval) {
    let _ = writeln!(o, "\nConverter (single-switch forward)");
    let side = match c.reset_side {
        ResetSide::Primary => "reset to the input",
        ResetSide::Secondary => "reset to the output",
    };
    let _ = writeln!(o, "  Np {} : Ns {} : Nr {}, {side}", c.np, c.ns, c.nr);
    let pct = |x: f64| x * 100.0;
    let _ = writeln!(
        o,
        "  reset duty limit       {:>7.1} %",
        pct(c.reset_duty_limit)
    );
    if c.reset_side == ResetSide::Secondary {
        let _ = writeln!(
            o,
            "    reset to the input, these turns would allow {:.1} % ({:.1} points more)",
            pct(c.reset_duty_limit_primary_side),
            pct(c.reset_duty_limit_primary_side - c.reset_duty_limit)
        );
        if let Some(ceil) = c.steady_duty_ceiling {
            let _ = writeln!(
                o,
                "    steady state: the reset takes Nr/Ns = {:.1} % of every period",
                pct(1.0 - ceil)
            );
        }
    }
    let _ = writeln!(
        o,
        "  duty available         {:>7.1} %",
        pct(c.duty_available)
    );
    let _ = writeln!(
        o,
        "  duty needed at vin min {:>7.1} %   ideal switch",
        pct(c.duty_needed_at_vin_min)
    );
    let drop = c.duty_needed_total_at_vin_min
        - c.duty_lost_to_leakage.unwrap_or(0.0)
        - c.duty_needed_at_vin_min;
    let mut extra = Vec::new();
    if drop > 0.0 {
        extra.push(format!("+ switch drop {:.2} %", pct(drop)));
    }
    if let Some(lost) = c.duty_lost_to_leakage {
        extra.push(format!("+ leakage {:.2} %", pct(lost)));
    }
    let with = if extra.is_empty() {
        String::new()
    } else {
        format!("{} = ", extra.join(", "))
    };
    let line = format!(
        "{with}{:.1} %, margin {:+.1} points",
        pct(c.duty_needed_total_at_vin_min),
        pct(c.duty_margin)
    );
    for l in wrap(&line, WIDTH - 4, "  ") {
        let _ = writeln!(o, "    {l}");
    }
    let _ = writeln!(
        o,
        "  duty needed at vin max {:>7.1} %",
        pct(c.duty_needed_at_vin_max)
    );
    let _ = writeln!(
        o,
        "  reset time             {:>7.2} us steady at vin min, {:.2} us worst case",
        c.reset_time_us, c.reset_time_worst_us
    );
    let rating = c
        .switch_rating_v
        .map_or(String::new(), |r| format!(", rated {r:.0} V"));
    let _ = writeln!(
        o,
        "  switch off-state       {:>7.1} V plus a spike set by the clamp{rating}",
        c.switch_voltage_v
    );
    if let (Some(loss), Some(pk), Some(l)) = (c.clamp_loss_w, c.clamp_peak_a, c.leakage_ps_uh) {
        let _ = writeln!(
            o,
            "  clamp or snubber       {:>7.3} W: 1/2 x {l:.2} uH (P-S) x ({pk:.3} A)^2 x f",
            loss
        );
    }
    match c.flux_swing_worst_mt {
        Some(b) => {
            let head = c
                .flux_headroom_mt
                .map_or(String::new(), |h| format!(" of {h:.0} mT headroom"));
            let _ = writeln!(o, "  worst-case flux swing  {b:>7.1} mT{head}");
            if let Some(s) = c.flux_swing_steady_mt {
                let _ = writeln!(o, "  steady-state swing     {s:>7.1} mT");
            }
        }
        None => {
            let _ = writeln!(
                o,
                "  flux, magnetising current, core loss: no [core] data for this bobbin"
            );
        }
    }
    if let (Some(al), Some(src), Some(lm)) = (c.al_nh, c.al_source, c.magnetising_uh) {
        let src = match src {
            AlSource::Core => "the core's figure",
            AlSource::Gapped => "from mu_i and the gap",
            AlSource::Ungapped => "from mu_i, no gap",
        };
        let _ = writeln!(
            o,
            "  AL {al:.0} nH ({src}): magnetising inductance {lm:.0} uH"
        );
    } else if c.flux_swing_worst_mt.is_some() {
        let _ = writeln!(
            o,
            "  no AL and no mu_i: magnetising current not computed (taken as zero)"
        );
    }
    if let (Some(im), Some(iw)) = (c.magnetising_peak_a, c.magnetising_peak_worst_a) {
        let _ = writeln!(
            o,
            "  magnetising current    {:>7.1} mA peak steady, {:.1} mA worst case",
            im * 1e3,
            iw * 1e3
        );
    }
    if let (Some(pk), Some(rms), Some(w)) = (c.reset_peak_a, c.reset_rms_a, c.reset_peak_worst_a) {
        let _ = writeln!(
            o,
            "  reset winding          {:>7.1} mA peak, {:.1} mA RMS ({:.1} mA peak worst)",
            pk * 1e3,
            rms * 1e3,
            w * 1e3
        );
        if let Some(j) = c.reset_current_density_a_mm2 {
            let why = if j <= crate::engine::limits::CURRENT_DENSITY_BAND_A_MM2.1 {
                "only magnetising current: thin wire is fine"
            } else {
                "too much for a thin wire (see warnings)"
            };
            let _ = writeln!(o, "    {j:.2} A/mm2 in the reset wire, {why}");
        }
    }
}

fn capacitance_block(o: &mut String, eval: &Evaluation) {
    let c = &eval.capacitance;
    let _ = writeln!(
        o,
        "\nCapacitance (plates across tape and enamel, eps_r 3.2 and 3.5, from memory)"
    );
    let _ = writeln!(
        o,
        "  primary - secondary    {:>8.1} pF",
        c.primary_secondary_pf
    );
    for (w, cs) in eval.windings.iter().zip(&c.self_pf) {
        if let Some(cs) = cs {
            let _ = writeln!(
                o,
                "  {:<8} self          {cs:>8.1} pF (layer energy method)",
                truncate(&w.name, 8)
            );
        }
    }
    if let Some(f) = c.ringing_khz {
        let _ = writeln!(
            o,
            "  ringing, P-S leakage against the primary's own: {:.2} MHz",
            f / 1e3
        );
    }
}

fn stress_block(o: &mut String, st: &crate::engine::stress::StressEval) {
    let _ = writeln!(
        o,
        "\nVoltage stress ({:.2} V a turn at most; usual working figures, from memory)",
        st.volts_per_turn_v
    );
    let mark = |v: f64, lim: f64| if v > lim { "  OVER" } else { "" };
    for l in &st.layers {
        let _ = writeln!(
            o,
            "  stack #{:<2} {:<8} layer to layer   {:>7.0} V of {:>5.0} V{}",
            l.section + 1,
            truncate(&l.winding, 8),
            l.voltage_v,
            l.limit_v,
            mark(l.voltage_v, l.limit_v)
        );
    }
    for b in &st.bifilar {
        let pair = format!("{}+{}", b.inner, b.outer);
        let _ = writeln!(
            o,
            "  stack #{:<2} {:<8} bifilar pair     {:>7.0} V of {:>5.0} V{}",
            b.inner_section + 1,
            truncate(&pair, 8),
            b.voltage_v,
            b.limit_v,
            mark(b.voltage_v, b.limit_v)
        );
    }
    for p in &st.between_sections {
        let pair = format!("{}/{}", p.inner, p.outer);
        let _ = writeln!(
            o,
            "  stack #{}/#{:<2} {:<6} between sections {:>7.0} V of {:>5.0} V{}",
            p.inner_section + 1,
            p.outer_section + 1,
            truncate(&pair, 6),
            p.voltage_v,
            p.limit_v,
            mark(p.voltage_v, p.limit_v)
        );
    }
    if st.layers.is_empty() && st.bifilar.is_empty() && st.between_sections.is_empty() {
        let _ = writeln!(
            o,
            "  single-layer sections, no bifilar pairs: nothing to check"
        );
    }
}

fn losses_block(o: &mut String, l: &LossEval) {
    let _ = writeln!(o, "\nLosses and temperature rise");
    let _ = writeln!(
        o,
        "  copper                 {:>7.3} W at vin min",
        l.copper_loss_w
    );
    if !l.windings_without_current.is_empty() {
        let _ = writeln!(
            o,
            "    not counted (no current): {}",
            l.windings_without_current.join(", ")
        );
    }
    match (l.core_loss_w, l.core_loss_kw_m3) {
        (Some(w), Some(p)) => {
            let _ = writeln!(
                o,
                "  core (iGSE)            {w:>7.3} W at vin max: {p:.1} kW/m3 x {:.0} mm3",
                l.core_volume_mm3.unwrap_or(0.0)
            );
            if let (Some(b), Some(d), Some(r)) =
                (l.core_swing_mt, l.core_duty, l.core_reset_fraction)
            {
                let _ = writeln!(
                    o,
                    "    swing {b:.1} mT, rising over {:.1} %, reset over {:.1} % of the period",
                    d * 100.0,
                    r * 100.0
                );
            }
        }
        _ => {
            let no_time = l.core_duty.is_some_and(|d| d <= 0.0)
                || l.core_reset_fraction.is_some_and(|r| r <= 0.0);
            let why = if l.core_volume_mm3.is_none() {
                "no [core] data"
            } else if no_time {
                "no duty available, so no flux waveform to take the loss of"
            } else {
                "no steinmetz coefficients in [material]"
            };
            let _ = writeln!(o, "  core                   not computed: {why}");
        }
    }
    let _ = writeln!(o, "  total                  {:>7.3} W", l.total_loss_w);
    match (l.surface_area_cm2, l.temperature_rise_c) {
        (Some(a), Some(t)) => {
            let how = if l.surface_estimated {
                "estimated from Wa x Ae"
            } else {
                "given"
            };
            let _ = writeln!(
                o,
                "  surface {a:.1} cm2 ({how}): {:.3} W/cm2",
                l.total_loss_w / a
            );
            let _ = writeln!(
                o,
                "  temperature rise       {t:>7.1} C (McLyman) against a {:.0} C limit",
                l.rise_limit_c
            );
            if let Some(hot) = l.hot_spot_c {
                let class = crate::engine::thermal::class_letter(l.class_limit_c)
                    .map_or(String::new(), |c| format!("class {c} "));
                let _ = writeln!(
                    o,
                    "  hot spot               {hot:>7.1} C in {:.0} C air, against {class}{:.0} C ({})",
                    l.ambient_c,
                    l.class_limit_c,
                    l.class_binding.key()
                );
            }
        }
        _ => {
            let _ = writeln!(
                o,
                "  temperature rise: not computed (no core data to estimate the surface;"
            );
            let _ = writeln!(o, "    give [operating] surface_area_cm2)");
        }
    }
}

fn limit_figure(l: &Limit, x: f64) -> String {
    match l.unit {
        "duty" => format!("{:.1} %", x * 100.0),
        "mm" => format!("{x:.2} mm"),
        "mT" => format!("{x:.0} mT"),
        "C" => format!("{x:.1} C"),
        u => format!("{x:.1} {u}"),
    }
}

fn limits_block(o: &mut String, eval: &Evaluation) {
    if eval.limits.is_empty() {
        return;
    }
    let _ = writeln!(o, "\nWhat limits the design (binding first)");
    let _ = writeln!(o, "  constraint            used        allowed     margin");
    for (i, l) in eval.limits.iter().enumerate() {
        let name = match &l.about {
            Some(a) => format!("{} ({})", l.constraint.key(), a),
            None => l.constraint.key().to_string(),
        };
        let tag = if l.broken() {
            "  BROKEN"
        } else if i == 0 {
            "  binding"
        } else {
            ""
        };
        let _ = writeln!(
            o,
            "  {:<20} {:>11}  {:>11}  {:>7.0} %{tag}",
            truncate(&name, 20),
            limit_figure(l, l.used),
            limit_figure(l, l.allowed),
            l.margin * 100.0
        );
    }
}
