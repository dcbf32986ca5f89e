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

/// The AC sums laid out once for every temperature round: which windings are summed under
/// the primary-secondary excitation, and each layer's visit in the order the sums take them,
/// with what of its D does not depend on the temperature. Only the skin depth changes
/// between rounds, so a round divides and sums.
pub(super) struct AcPlan {
    /// The first primary and secondary, when both exist.
    pair: Option<(usize, usize)>,
    /// They share a bifilar section: both are left without AC figures, with a warning.
    bifilar_ps: bool,
    /// Each winding's memoised spectrum, with its DC part and RMS squared.
    spectra: Vec<Option<(usize, f64, f64)>>,
    /// The primary's drive of the field the other windings sit in: its spectrum, or a
    /// sinusoid of its RMS (squared).
    primary_drive: Option<(Option<usize>, f64)>,
    visits: Vec<Visit>,
}

/// One layer's part in the sums. `d_delta` is the layer's D times the skin depth (mm), the
/// D at a temperature being `d_delta / delta`; `None` for a layer with no Dowell D (litz,
/// foil without a breadth), whose D is 0.
enum Visit {
    /// A layer of winding `k` summed with the MMF `faces` at its faces ([`AcSums::layer`]).
    Layer {
        k: usize,
        d_delta: Option<f64>,
        faces: (f64, f64),
        turns: u32,
        length: f64,
    },
    /// A layer of winding `k` outside the pair, in the pair's field: its proximity loss is
    /// `weight x (2 a - 4 b)` with Dowell's summed terms at its D (`weight` = length x mean
    /// square MMF / turns^2).
    Proximity {
        k: usize,
        d_delta: Option<f64>,
        weight: f64,
    },
}

impl Visit {
    /// The layer's D at skin depth `delta_mm`.
    fn d(d_delta: Option<f64>, delta_mm: f64) -> f64 {
        d_delta.map_or(0.0, |x| x / delta_mm)
    }
}

impl AcPlan {
    /// The plan of a build with a frequency (none without one).
    pub(super) fn of(inputs: &AcInputs<'_>, memo: &mut Memo) -> Option<Self> {
        let AcInputs {
            build,
            laid,
            wires,
            currents,
        } = *inputs;
        build.setup.frequency_khz?;
        // The wound breadth: the turns lie between the margins, and so does the field.
        let b_w = layout::usable_width_mm(build);
        let spectra: Vec<Option<(usize, f64, f64)>> = currents
            .iter()
            .map(|c| {
                c.waveform.as_ref().map(|wave| {
                    let si = memo.spectrum(wave);
                    let sp = memo.spectrum_of(si);
                    (si, sp.dc, sp.rms_sq)
                })
            })
            .collect();
        // D is found once per layer at the switching frequency; the n-th harmonic's is D
        // sqrt(n). Foil: Dowell's D with the foil's thickness as the layer height and
        // porosity = width / breadth. Litz: no Dowell layer (0 gives a resistive one);
        // `litz_factors` sets it.
        let d_delta = |k: usize, turns: u32| match build.windings[k].conductor {
            Conductor::Round => {
                let conductors = f64::from(turns) * f64::from(build.windings[k].strands.max(1));
                Some(ac::layer_d_times_delta(conductors, wires[k].bare_mm, b_w))
            }
            // As `foil_d`: no D without a breadth (a NaN breadth goes through, as there).
            Conductor::Foil(_) if b_w <= 0.0 => None,
            Conductor::Foil(f) => {
                Some(ac::foil_d_times_delta(f.thickness_mm, f.width_on(b_w), b_w))
            }
            Conductor::Litz(_) => None,
        };
        let p = build.windings.iter().position(|w| w.role == Role::Primary);
        let s = build
            .windings
            .iter()
            .position(|w| w.role == Role::Secondary);
        let pair = p.zip(s);
        let bifilar_ps = pair.is_some_and(|(p, s)| {
            laid.iter().any(|l| {
                matches!(&l.kind, LaidKind::Winding { winding: Some(a), partner: Some(b), .. }
                    if (*a == p && *b == s) || (*a == s && *b == p))
            })
        });
        // A visit per layer and winding in it: room for all in one allocation.
        let layers: usize = laid
            .iter()
            .map(|l| match &l.kind {
                LaidKind::Winding {
                    partner, layers, ..
                } => layers.len() * (1 + usize::from(partner.is_some())),
                LaidKind::Tape { .. } => 0,
            })
            .sum();
        let mut plan = AcPlan {
            pair,
            bifilar_ps,
            primary_drive: None,
            spectra,
            visits: Vec::with_capacity(layers),
        };
        if let Some((p, s)) = pair
            && !bifilar_ps
        {
            plan.pair_field(build, laid, currents, (p, s), &d_delta);
        }
        plan.unpaired(laid, &d_delta);
        Some(plan)
    }

    /// The first primary and first secondary under their leakage excitation, the primary's
    /// current driving the field every other winding in the window sits in.
    fn pair_field(
        &mut self,
        build: &Build,
        laid: &[Laid],
        currents: &[WindingCurrent],
        (p, s): (usize, usize),
        d_delta: &impl Fn(usize, u32) -> Option<f64>,
    ) {
        // The primary's current drives the field the other windings sit in: its spectrum
        // (scaled to the RMS used), or a sinusoid of its RMS.
        self.primary_drive = match (self.spectra[p], currents[p].rms_a) {
            (Some((si, _, rms_sq)), _) if rms_sq > 0.0 => Some((Some(si), rms_sq)),
            (_, Some(i)) if i > 0.0 => Some((None, i * i)),
            _ => None,
        };
        let driven = self.primary_drive.is_some();
        let return_per_turn =
            -f64::from(build.windings[p].turns) / f64::from(build.windings[s].turns.max(1));
        let weight = leakage::pair_weights(p, s, return_per_turn);
        let visits = &mut self.visits;
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
                visits.push(Visit::Layer {
                    k,
                    d_delta: d_delta(k, layer.turns),
                    faces: (slab.f_a, slab.f_b),
                    turns: layer.turns,
                    length: f64::from(layer.turns) * layer.mlt_mm,
                });
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
                if f2 <= 0.0 || layer.turns == 0 || !driven {
                    continue;
                }
                let n_l = f64::from(layer.turns);
                let length = f64::from(layer.turns) * layer.mlt_mm;
                visits.push(Visit::Proximity {
                    k,
                    d_delta: d_delta(k, layer.turns),
                    weight: length * f2 / (n_l * n_l),
                });
            }
        });
    }

    /// Every winding not in the pair: each of its sections alone, from zero MMF at its face.
    fn unpaired(&mut self, laid: &[Laid], d_delta: &impl Fn(usize, u32) -> Option<f64>) {
        for l in laid {
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
                if self.pair.is_some_and(|(p, s)| k == p || k == s) {
                    continue;
                }
                let mut f = 0.0;
                for layer in layers {
                    let f_b = f + f64::from(layer.turns);
                    self.visits.push(Visit::Layer {
                        k,
                        d_delta: d_delta(k, layer.turns),
                        faces: (f, f_b),
                        turns: layer.turns,
                        length: f64::from(layer.turns) * layer.mlt_mm,
                    });
                    f = f_b;
                }
            }
        }
    }
}

/// AC factors per the spec at the winding temperature `temperature_c`: the first primary and
/// first secondary under their leakage excitation, every other winding section by section
/// from zero MMF. Into each winding's figures, with the warnings they raise.
pub(super) fn ac_figures(
    plan: &AcPlan,
    inputs: &AcInputs<'_>,
    temperature_c: f64,
    windings: &mut [WindingEval],
    warnings: &mut Vec<Warning>,
    memo: &mut Memo,
) {
    let build = inputs.build;
    let Some(f_khz) = build.setup.frequency_khz else {
        return;
    };
    let delta_mm = ac::skin_depth_m(rho_ohm_m(temperature_c), f_khz * 1e3) / MM;
    let b_w = layout::usable_width_mm(build);
    let mut sums: Vec<AcSums> = plan
        .spectra
        .iter()
        .map(|&spectrum| AcSums {
            spectrum,
            ..AcSums::default()
        })
        .collect();
    if let Some((p, s)) = plan.pair {
        if plan.bifilar_ps {
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
            sums[p].paired = true;
            sums[s].paired = true;
        }
    }
    for visit in &plan.visits {
        match *visit {
            Visit::Layer {
                k,
                d_delta,
                faces,
                turns,
                length,
            } => sums[k].layer(memo, Visit::d(d_delta, delta_mm), faces, turns, length),
            Visit::Proximity { k, d_delta, weight } => {
                let d = Visit::d(d_delta, delta_mm);
                let (a, b) = match plan.primary_drive {
                    Some((Some(si), _)) => memo.summed_terms(si, d),
                    Some((None, rms_sq)) => {
                        let t = ac::d_terms(d);
                        (t.0 * rms_sq, t.1 * rms_sq)
                    }
                    None => continue,
                };
                sums[k].proximity += weight * (2.0 * a - 4.0 * b).max(0.0);
            }
        }
    }
    apply_sums(windings, &sums, delta_mm);
    super::ac_litz::litz_factors(build, windings, &sums, memo, (delta_mm, b_w), warnings);
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
