//! The Pareto set over (total loss, leakage, spare height): keep what no other candidate beats
//! on every objective at once.

/// Objectives of one candidate: lower loss, lower leakage and more spare height are better.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Objectives {
    /// Total loss (W).
    pub loss_w: f64,
    /// Primary-secondary leakage (uH).
    pub leakage_uh: f64,
    /// Window height left over (mm).
    pub spare_height_mm: f64,
}

impl Objectives {
    /// The objectives at the resolution a winder cares about: loss and leakage in steps of
    /// 1 % (log scale), spare height in steps of 0.05 mm. Candidates that differ by less are
    /// the same on the front, so it lists real trade-offs rather than hundredths of a watt.
    pub fn coarse(&self) -> Objectives {
        let step = |x: f64| {
            if x > 0.0 {
                (x.ln() / 1.01f64.ln()).round()
            } else {
                f64::NEG_INFINITY
            }
        };
        Objectives {
            loss_w: step(self.loss_w),
            leakage_uh: step(self.leakage_uh),
            spare_height_mm: (self.spare_height_mm / 0.05).floor(),
        }
    }

    /// The exact objectives in the order the front prefers among candidates alike at its
    /// resolution: least loss, then least leakage, then most spare height.
    pub fn exact_cmp(&self, other: &Objectives) -> std::cmp::Ordering {
        self.loss_w
            .total_cmp(&other.loss_w)
            .then(self.leakage_uh.total_cmp(&other.leakage_uh))
            .then(other.spare_height_mm.total_cmp(&self.spare_height_mm))
    }

    /// Strictly ahead of `other` in [`Objectives::exact_cmp`]'s order.
    pub fn finer(&self, other: &Objectives) -> bool {
        self.exact_cmp(other).is_lt()
    }

    /// `self` is at least as good on every objective and strictly better on one.
    pub fn dominates(&self, other: &Objectives) -> bool {
        let no_worse = self.loss_w <= other.loss_w
            && self.leakage_uh <= other.leakage_uh
            && self.spare_height_mm >= other.spare_height_mm;
        let better = self.loss_w < other.loss_w
            || self.leakage_uh < other.leakage_uh
            || self.spare_height_mm > other.spare_height_mm;
        no_worse && better
    }
}

/// Indices of the non-dominated items, in their original order. Of candidates with equal
/// objectives only the first is kept, so the set has no duplicates.
pub fn pareto_indices(items: &[Objectives]) -> Vec<usize> {
    let mut keep: Vec<usize> = Vec::new();
    for (i, o) in items.iter().enumerate() {
        if keep
            .iter()
            .any(|&k| items[k].dominates(o) || items[k] == *o)
        {
            continue;
        }
        keep.retain(|&k| !o.dominates(&items[k]));
        keep.push(i);
    }
    keep.sort_unstable();
    keep
}

#[cfg(test)]
mod tests {
    use super::*;

    fn o(loss_w: f64, leakage_uh: f64, spare_height_mm: f64) -> Objectives {
        Objectives {
            loss_w,
            leakage_uh,
            spare_height_mm,
        }
    }

    #[test]
    fn keeps_only_non_dominated_points() {
        let items = [
            o(1.0, 1.0, 1.0),
            o(2.0, 2.0, 0.5),
            o(0.5, 3.0, 1.0),
            o(1.0, 1.0, 1.0),
        ];
        assert_eq!(pareto_indices(&items), vec![0, 2]);
    }

    #[test]
    fn brute_force_agrees_on_a_grid() {
        let mut items = Vec::new();
        for a in 0..4 {
            for b in 0..4 {
                for c in 0..3 {
                    items.push(o(
                        f64::from((a * 7 + b * 3) % 5),
                        f64::from((b * 5 + c) % 4),
                        f64::from((a + c * 2) % 3),
                    ));
                }
            }
        }
        let fast = pareto_indices(&items);
        let brute: Vec<usize> = (0..items.len())
            .filter(|&i| !items.iter().any(|x| x.dominates(&items[i])))
            .filter(|&i| !(0..i).any(|j| items[j] == items[i]))
            .collect();
        assert_eq!(fast, brute);
    }
}
