//! The converter's operating point and the core material, both optional in a build.

/// Where the reset winding returns the magnetising energy.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ResetSide {
    /// The reset winding clamps to the input.
    Primary,
    /// The reset winding returns the magnetising energy to the output.
    Secondary,
}

/// One output of the converter (a `[[output]]` table): the secondary winding that feeds it,
/// the voltage it should give and the current it delivers.
#[derive(Debug, Clone, PartialEq)]
pub struct Output {
    /// The name of a secondary winding.
    pub winding: String,
    /// Target voltage (V).
    pub vout_v: f64,
    /// Load current (A).
    pub iout_a: f64,
    /// This output's rectifier drop; `None` takes `[operating] rectifier_drop_v`.
    pub rectifier_drop_v: Option<f64>,
}

/// An output's figures once the defaults are taken (see [`Operating::outputs_or_shorthand`]).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OutputFigures<'a> {
    /// The secondary winding's name; `None` for the shorthand (the first secondary).
    pub winding: Option<&'a str>,
    /// Target voltage (V).
    pub vout_v: f64,
    /// Load current (A).
    pub iout_a: f64,
    /// Rectifier drop (V), the output's own or `[operating]`'s.
    pub rectifier_drop_v: f64,
}

/// The forward converter's operating point: input range, output and the switch.
#[derive(Debug, Clone, PartialEq)]
pub struct Operating {
    /// Where the reset winding returns its energy; default the input.
    pub reset_side: ResetSide,
    /// Lowest input voltage (V), where the duty is highest.
    pub vin_min_v: f64,
    /// Highest input voltage (V), where the switch sees the most off-state voltage.
    pub vin_max_v: f64,
    /// The regulated output's voltage and current. Without `outputs` these are the one-output
    /// shorthand (`[operating] vout_v`, `iout_a`, on the first secondary); with `outputs` they
    /// mirror the first output's (the loader and [`Operating::set_regulated`] keep them so),
    /// and the engine reads [`Operating::regulated`].
    pub vout_v: f64,
    /// Output current (A).
    pub iout_a: f64,
    /// `[operating] rectifier_drop_v`: the shorthand's drop, and the drop of every output
    /// that does not give its own.
    pub rectifier_drop_v: f64,
    /// The `[[output]]` tables in file order, the first the regulated one; empty for the
    /// one-output shorthand.
    pub outputs: Vec<Output>,
    /// The controller's maximum duty (0 to 1); `None` leaves the reset limit alone to cap it.
    pub duty_limit: Option<f64>,
    /// Temperature rise the user accepts; `None` takes the engine's default.
    pub rise_limit_c: Option<f64>,
    /// Outer surface of the wound transformer; `None` lets the engine estimate it.
    pub surface_area_cm2: Option<f64>,
    /// On-state drop of the switch (V), taken off the input while it conducts; default 0.
    pub switch_drop_v: f64,
    /// Air around the transformer (C); `None` takes the engine's default.
    pub ambient_c: Option<f64>,
    /// Rated off-state voltage of the switch (V), checked against the off-state voltage.
    pub switch_rating_v: Option<f64>,
}

impl Operating {
    /// Every output with its defaults taken, the regulated one first: the `[[output]]`
    /// tables, or the shorthand's one output.
    pub fn outputs_or_shorthand(&self) -> Vec<OutputFigures<'_>> {
        self.output_figures().collect()
    }

    /// [`Operating::outputs_or_shorthand`] one by one, without building the list.
    pub fn output_figures(&self) -> impl Iterator<Item = OutputFigures<'_>> + '_ {
        let shorthand = self.outputs.is_empty().then_some(OutputFigures {
            winding: None,
            vout_v: self.vout_v,
            iout_a: self.iout_a,
            rectifier_drop_v: self.rectifier_drop_v,
        });
        let tables = self.outputs.iter().map(|o| OutputFigures {
            winding: Some(&o.winding),
            vout_v: o.vout_v,
            iout_a: o.iout_a,
            rectifier_drop_v: o.rectifier_drop_v.unwrap_or(self.rectifier_drop_v),
        });
        shorthand.into_iter().chain(tables)
    }

    /// The regulated output (the first `[[output]]`, else the shorthand).
    pub fn regulated(&self) -> OutputFigures<'_> {
        match self.outputs.first() {
            None => OutputFigures {
                winding: None,
                vout_v: self.vout_v,
                iout_a: self.iout_a,
                rectifier_drop_v: self.rectifier_drop_v,
            },
            Some(o) => OutputFigures {
                winding: Some(&o.winding),
                vout_v: o.vout_v,
                iout_a: o.iout_a,
                rectifier_drop_v: o.rectifier_drop_v.unwrap_or(self.rectifier_drop_v),
            },
        }
    }

    /// Set the regulated output's voltage and current, in the shorthand and in the first
    /// `[[output]]` alike.
    pub fn set_regulated(&mut self, vout_v: f64, iout_a: f64) {
        self.vout_v = vout_v;
        self.iout_a = iout_a;
        self.sync_outputs();
    }

    /// After an edit of `vout_v` or `iout_a`: the first `[[output]]` takes them too.
    pub fn sync_outputs(&mut self) {
        if let Some(o) = self.outputs.first_mut() {
            o.vout_v = self.vout_v;
            o.iout_a = self.iout_a;
        }
    }
}

/// Steinmetz coefficients: P in kW/m^3 with f in kHz and B in T.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Steinmetz {
    /// Coefficient k (kW/m^3 at 1 kHz and 1 T).
    pub k: f64,
    /// Frequency exponent alpha.
    pub alpha: f64,
    /// Flux density exponent beta.
    pub beta: f64,
}

/// The core's ferrite. With a bundled ferrite named (the file's `grade`), the values are its
/// typical figures with the file's explicit keys written over them; the values here are always
/// the resolved ones.
#[derive(Debug, Clone, PartialEq)]
pub struct Material {
    /// The id of the bundled generic ferrite the typical figures come from, when one is named
    /// (the file's key `grade`).
    pub ferrite: Option<String>,
    /// Saturation flux density (mT) at the working temperature.
    pub bsat_mt: f64,
    /// Remanent flux density (mT), where the flux returns to after each cycle.
    pub br_mt: f64,
    /// Initial permeability of the ferrite, when known.
    pub mu_i: Option<f64>,
    /// Core-loss coefficients, when known.
    pub steinmetz: Option<Steinmetz>,
    /// Total air gap in the magnetic path of the assembled core; with `mu_i` it sets AL.
    pub gap_mm: Option<f64>,
}
