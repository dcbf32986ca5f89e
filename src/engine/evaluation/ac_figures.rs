//! The AC resistance factors of the windings, layer by layer.

use super::*;

/// One winding's AC sums over the layers it has, as [`ac_figures`] collects them.
#[derive(Debug, Clone, Copy, Default)]
pub(super) struct AcSums {
    /// Taken from the primary-secondary excitation (else section by section from zero MMF).
    paired: bool,
    /// Left without AC figures (wound bifilar across the primary-secondary pair).
    pub(super) skip: bool,
    /// The memoised spectrum of the winding's waveform, with its DC part and RMS squared.
    pub(super) spectrum: Option<(usize, f64, f64)>,
    /// Sum of the layer lengths (turns x MLT).
    pub(super) length: f64,
    /// Sum of each layer's mean square MMF, in turns of this winding, weighted by length:
    /// what a litz winding's strands see (`engine::litz`).
    pub(super) f2: f64,
    /// Sum of the sinusoidal layer factors weighted by length.
    sine: f64,
    /// Sum of the layers' waveform AC power shares weighted by length.
    wave: f64,
    /// Proximity loss from the primary-secondary field, per ohm per metre of this winding:
    /// sum over its layers of `length x F^2 / n_l^2 x (2 a - 4 b)` (see `ac_figures`).
    proximity: f64,
}

impl AcSums {
    /// Add one layer: its D at the switching frequency, the MMF at its faces and its length.
    fn layer(&mut self, memo: &mut Memo, d: f64, (f_a, f_b): (f64, f64), turns: u32, length: f64) {
        self.length += length;
        // The faces' MMF scaled to this winding's own turns: a layer of `turns` spans `turns`.
        let df = (f_b - f_a).abs();
        if df > 0.0 {
            let k = f64::from(turns) / df;
            let (a, b) = (f_a * k, f_b * k);
            self.f2 += length * (a * a + a * b + b * b) / 3.0;
        }
        self.sine += memo.layer_factor(d, f_a, f_b) * length;
        if let Some((si, dc, rms_sq)) = self.spectrum
            && rms_sq > 0.0
        {
            // Hurley's sum is linear in each layer's two Dowell terms, and layers of the same
            // turns share their D: the harmonics are summed once per distinct D (memoised).
            let share = if f_b == f_a || d < ac::D_SMALL {
                rms_sq - dc * dc
            } else {
                ac::layer_factor_from(memo.summed_terms(si, d), f_a, f_b)
            };
            self.wave += share * length;
        }
    }
}

/// What the AC figures are found from, the same at every temperature: the build, its
/// sections as laid, each winding's wire and current.
pub(super) struct AcInputs<'a> {
    pub(super) build: &'a Build,
    pub(super) laid: &'a [Laid],
    pub(super) wires: &'a [crate::library::wires::ResolvedWire],
    pub(super) currents: &'a [WindingCurrent],
}

/// AC factors per the spec at the winding temperature `temperature_c`: the first primary and
/// first secondary under their leakage excitation, every other winding section by section
/// from zero MMF. Into each winding's figures, with the warnings they raise.
pub(super) fn ac_figures(
    inputs: &AcInputs<'_>,
    temperature_c: f64,
    windings: &mut [WindingEval],
    warnings: &mut Vec<Warning>,
    memo: &mut Memo,
) {
    let AcInputs {
        build,
        laid,
        wires,
        currents,
    } = *inputs;
    let Some(f_khz) = build.setup.frequency_khz else {
        return;
    };
    let delta_mm = ac::skin_depth_m(rho_ohm_m(temperature_c), f_khz * 1e3) / MM;
    // The wound breadth: the turns lie between the margins, and so does the field.
    let b_w = layout::usable_width_mm(build);
    let p = build.windings.iter().position(|w| w.role == Role::Primary);
    let s = build
        .windings
        .iter()
        .position(|w| w.role == Role::Secondary);

    let mut sums: Vec<AcSums> = currents
        .iter()
        .map(|c| AcSums {
            spectrum: c.waveform.as_ref().map(|wave| {
                let si = memo.spectrum(wave);
                let sp = memo.spectrum_of(si);
                (si, sp.dc, sp.rms_sq)
            }),
            ..AcSums::default()
        })
        .collect();
    // D is found once per layer at the switching frequency; the n-th harmonic's is D sqrt(n).
    // Foil: Dowell's D with the foil's thickness as the layer height and porosity = width /
    // breadth. Litz: no Dowell layer (0 gives a resistive one); `litz_factors` sets it.
    let d_of = |k: usize, turns: u32| match build.windings[k].conductor {
        Conductor::Round => {
            let conductors = f64::from(turns) * f64::from(build.windings[k].strands.max(1));
            ac::layer_d(conductors, wires[k].bare_mm, b_w, delta_mm)
        }
        Conductor::Foil(f) => ac::foil_d(f.thickness_mm, f.width_on(b_w), b_w, delta_mm),
        Conductor::Litz(_) => 0.0,
    };

    let window = Window {
        build,
        laid,
        currents,
        d_of: &d_of,
    };
    if let (Some(p), Some(s)) = (p, s) {
        pair_sums(&window, (p, s), windings, &mut sums, warnings, memo);
    }
    unpaired_sums(&window, &mut sums, memo);
    apply_sums(windings, &sums, delta_mm);
    super::ac_litz::litz_factors(build, windings, &sums, memo, (delta_mm, b_w), warnings);
}

/// What the AC sums read of the build: the windings as laid in the window, their currents,
/// and each layer's D at the switching frequency (`d_of(winding, turns in the layer)`).
struct Window<'a, D: Fn(usize, u32) -> f64> {
    build: &'a Build,
    laid: &'a [Laid],
    currents: &'a [WindingCurrent],
    d_of: &'a D,
}

/// The first primary and first secondary under their leakage excitation, and every other
/// winding in their field; a bifilar primary-secondary pair is skipped with a warning.
fn pair_sums(
    window: &Window<'_, impl Fn(usize, u32) -> f64>,
    (p, s): (usize, usize),
    windings: &[WindingEval],
    sums: &mut [AcSums],
    warnings: &mut Vec<Warning>,
    memo: &mut Memo,
) {
    let bifilar_ps = window.laid.iter().any(|l| {
        matches!(&l.kind, LaidKind::Winding { winding: Some(a), partner: Some(b), .. }
            if (*a == p && *b == s) || (*a == s && *b == p))
    });
    if bifilar_ps {
        sums[p].skip = true;
        sums[s].skip = true;
        warnings.push(Warning {
            at: WarningAt::Winding(p),
            kind: WarningKind::AcBifilarPs {
                primary: windings[p].name.clone(),
                secondary: windings[s].name.clone(),
            },
        });
    } else {
        pair_field(window, (p, s), sums, memo);
    }
}

/// The first primary and first secondary under their leakage excitation, the primary's
/// current driving the field every other winding in the window sits in.
fn pair_field(
    window: &Window<'_, impl Fn(usize, u32) -> f64>,
    (p, s): (usize, usize),
    sums: &mut [AcSums],
    memo: &mut Memo,
) {
    let Window {
        build,
        laid,
        currents,
        d_of,
    } = *window;
    sums[p].paired = true;
    sums[s].paired = true;
    // The primary's current drives the field the other windings sit in: its spectrum
    // (scaled to the RMS used), or a sinusoid of its RMS.
    let primary_drive = match (sums[p].spectrum, currents[p].rms_a) {
        (Some((si, _, rms_sq)), _) if rms_sq > 0.0 => Some((Some(si), rms_sq)),
        (_, Some(i)) if i > 0.0 => Some((None, i * i)),
        _ => None,
    };
    let return_per_turn =
        -f64::from(build.windings[p].turns) / f64::from(build.windings[s].turns.max(1));
    let weight = leakage::pair_weights(p, s, return_per_turn);
    leakage::for_each_slab_by(laid, weight, |slab| {
        let Some((si, li)) = slab.layer else { return };
        let LaidKind::Winding {
            winding,
            partner,
            layers,
            ..
        } = &laid[si].kind
        else {
            return;
        };
        let layer = &layers[li];
        // A bifilar partner other than P or S carries nothing in this excitation, so
        // the slab's faces are this winding's own MMF.
        for k in [*winding, *partner]
            .into_iter()
            .flatten()
            .filter(|&k| k == p || k == s)
        {
            let length = f64::from(layer.turns) * layer.mlt_mm;
            sums[k].layer(
                memo,
                d_of(k, layer.turns),
                (slab.f_a, slab.f_b),
                layer.turns,
                length,
            );
        }
        // Any other winding here sits in the field of P and S: Dowell's layer with
        // the same field on both faces loses `R_layer (F/n_l)^2 D (2 G1 - 4 G2)` per
        // ampere squared of the primary's, summed over its harmonics. A bifilar
        // partner sees a field that runs from F_a to F_b across the layer: its mean
        // square is taken.
        for k in [*winding, *partner]
            .into_iter()
            .flatten()
            .filter(|&k| k != p && k != s)
        {
            let (fa, fb) = (slab.f_a, slab.f_b);
            let f2 = (fa * fa + fa * fb + fb * fb) / 3.0;
            if f2 <= 0.0 || layer.turns == 0 {
                continue;
            }
            let d = d_of(k, layer.turns);
            let (a, b) = match primary_drive {
                Some((Some(si), _)) => memo.summed_terms(si, d),
                Some((None, rms_sq)) => {
                    let t = ac::d_terms(d);
                    (t.0 * rms_sq, t.1 * rms_sq)
                }
                None => continue,
            };
            let n_l = f64::from(layer.turns);
            let length = f64::from(layer.turns) * layer.mlt_mm;
            sums[k].proximity += length * f2 / (n_l * n_l) * (2.0 * a - 4.0 * b).max(0.0);
        }
    });
}

/// Every winding not in the pair: each of its sections alone, from zero MMF at its face.
fn unpaired_sums(
    window: &Window<'_, impl Fn(usize, u32) -> f64>,
    sums: &mut [AcSums],
    memo: &mut Memo,
) {
    let d_of = window.d_of;
    for l in window.laid {
        let LaidKind::Winding {
            winding,
            partner,
            layers,
            ..
        } = &l.kind
        else {
            continue;
        };
        for k in [*winding, *partner].into_iter().flatten() {
            if sums[k].paired || sums[k].skip {
                continue;
            }
            let mut f = 0.0;
            for layer in layers {
                let f_b = f + f64::from(layer.turns);
                let length = f64::from(layer.turns) * layer.mlt_mm;
                sums[k].layer(memo, d_of(k, layer.turns), (f, f_b), layer.turns, length);
                f = f_b;
            }
        }
    }
}

/// The AC factors and proximity loss of each winding from its sums (mm of skin depth).
fn apply_sums(windings: &mut [WindingEval], sums: &[AcSums], delta_mm: f64) {
    for (w, sum) in windings.iter_mut().zip(sums) {
        let total = sum.length;
        if sum.skip || total <= 0.0 {
            continue;
        }
        let ac_factor = sum.sine / total;
        let ac_factor_waveform = sum.spectrum.map(|(_, dc, rms_sq)| {
            if rms_sq <= 0.0 {
                1.0
            } else {
                (dc * dc * total + sum.wave) / (rms_sq * total)
            }
        });
        // Per ohm of the winding's DC resistance: its layers' share by length.
        w.proximity_loss_w = (sum.proximity > 0.0).then(|| w.dcr_ohm / total * sum.proximity);
        w.ac = Some(AcFigures {
            skin_depth_mm: delta_mm,
            ac_factor,
            rac_ohm: ac_factor * w.dcr_ohm,
            ac_factor_waveform,
            rac_waveform_ohm: ac_factor_waveform.map(|f| f * w.dcr_ohm),
        });
    }
}
