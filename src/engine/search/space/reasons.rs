//! Why candidates were turned down, counted for the "nothing fits" answer.

use super::*;

/// Counts of why evaluated candidates were turned down, for the "nothing fits" answer.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Reasons {
    pub too_tall: usize,
    pub out_of_band: usize,
    pub leakage: usize,
    pub temperature: usize,
    pub invalid: usize,
    /// The least height with allowance seen, and the window height.
    pub least_height_mm: Option<(f64, f64)>,
    /// The least lower bound on the height with allowance among in-band combinations.
    pub least_bound_mm: Option<f64>,
    /// Combinations whose wires all run inside the band.
    pub in_band: usize,
    /// Of those, evaluated ones that fit the window.
    pub in_band_fit: usize,
}

impl Reasons {
    /// Does the evaluated candidate meet every constraint? Counts the reason when not.
    pub fn accept(&mut self, eval: &Evaluation, settings: &Settings, sized: &[bool]) -> bool {
        if eval.warnings.iter().any(|w| w.code() == "invalid") {
            self.invalid += 1;
            return false;
        }
        let band = settings.j_min_a_mm2 - 1e-12..=settings.j_max_a_mm2 + 1e-12;
        let outside = eval.windings.iter().zip(sized).any(|(w, &sized)| {
            sized && w.current_density_a_mm2.is_some_and(|j| !band.contains(&j))
        });
        if outside {
            self.out_of_band += 1;
            return false;
        }
        let h = eval.height_with_allowance_mm;
        if self.least_height_mm.is_none_or(|(l, _)| h < l) {
            self.least_height_mm = Some((h, eval.window_height_mm));
        }
        if !eval.fits {
            self.too_tall += 1;
            return false;
        }
        self.in_band_fit += 1;
        if let Some(max) = settings.max_leakage_uh
            && eval.leakage.iter().any(|l| l.uh > max)
        {
            self.leakage += 1;
            return false;
        }
        if let Some(l) = &eval.losses
            && let Some(rise) = l.temperature_rise_c
            && rise > settings.max_rise_c.unwrap_or(l.rise_limit_c)
        {
            self.temperature += 1;
            return false;
        }
        true
    }

    pub fn merge(&mut self, o: &Reasons) {
        self.too_tall += o.too_tall;
        self.out_of_band += o.out_of_band;
        self.leakage += o.leakage;
        self.temperature += o.temperature;
        self.invalid += o.invalid;
        if let Some((h, w)) = o.least_height_mm
            && self.least_height_mm.is_none_or(|(l, _)| h < l)
        {
            self.least_height_mm = Some((h, w));
        }
        if let Some(b) = o.least_bound_mm
            && self.least_bound_mm.is_none_or(|l| b < l)
        {
            self.least_bound_mm = Some(b);
        }
        self.in_band += o.in_band;
        self.in_band_fit += o.in_band_fit;
    }

    /// The constraint that binds when nothing survived. The same answer with or without
    /// pruning: first the band, then the window, then leakage and temperature.
    pub fn binding(
        &self,
        space: usize,
        settings: &Settings,
        window_mm: f64,
        out_of_band: Vec<Name>,
    ) -> Binding {
        let (j_min_a_mm2, j_max_a_mm2) = (settings.j_min_a_mm2, settings.j_max_a_mm2);
        if space == 0 {
            return Binding::EmptySpace;
        }
        if self.in_band == 0 {
            return Binding::CurrentBand {
                j_min_a_mm2,
                j_max_a_mm2,
                windings: out_of_band,
            };
        }
        if self.in_band_fit == 0 {
            let least = match (self.least_height_mm, self.least_bound_mm) {
                (Some((height_mm, window_mm)), _) => Some(LeastHeight::Evaluated {
                    height_mm,
                    window_mm,
                }),
                (None, Some(height_mm)) => Some(LeastHeight::Bound {
                    height_mm,
                    window_mm,
                }),
                _ => None,
            };
            return Binding::WindowHeight {
                j_min_a_mm2,
                j_max_a_mm2,
                in_band: self.in_band,
                least,
            };
        }
        if self.temperature >= self.leakage {
            Binding::TemperatureRise
        } else {
            Binding::Leakage
        }
    }
}
