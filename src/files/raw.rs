//! The file shapes exactly as written (serde types with spans), before they become the model.
//! Fields carry the file's key names; where the model names an idea otherwise the converters
//! map it (`grade` -> `Material::ferrite`, a section's `with` -> `WindingSection::partner`,
//! `bulge` -> `Setup::allowance_factor`).

use serde::Deserialize;
use serde::de::{self, MapAccess, Visitor};
use std::fmt;
use toml::Spanned;

/// The bobbin keys, shared by a bobbin file (which must say `format`) and an inline
/// `[bobbin]` table in a build (which need not).
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct BobbinBody {
    pub format: Option<Spanned<i64>>,
    pub name: Option<String>,
    pub origin: Option<String>,
    pub window: Spanned<WindowRaw>,
    pub tube: Spanned<TubeRaw>,
    pub core: Option<Spanned<CoreRaw>>,
    pub pins: Option<PinsRaw>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WindowRaw {
    pub width_mm: Spanned<f64>,
    pub height_mm: Spanned<f64>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct TubeRaw {
    pub shape: Spanned<String>,
    pub width_mm: Option<Spanned<f64>>,
    pub depth_mm: Option<Spanned<f64>>,
    pub corner_radius_mm: Option<Spanned<f64>>,
    pub diameter_mm: Option<Spanned<f64>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct CoreRaw {
    pub ae_mm2: Spanned<f64>,
    pub le_mm: Spanned<f64>,
    pub ve_mm3: Option<Spanned<f64>>,
    pub al_nh: Option<Spanned<f64>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct PinsRaw {
    pub count: Spanned<u32>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct BuildFile {
    pub format: Spanned<i64>,
    pub title: Option<String>,
    pub bobbin: Spanned<BobbinField>,
    pub setup: Option<SetupRaw>,
    #[serde(default)]
    pub winding: Vec<Spanned<WindingRaw>>,
    #[serde(default)]
    pub stack: Vec<Spanned<SectionRaw>>,
    pub operating: Option<Spanned<OperatingRaw>>,
    /// `[[output]]`: the converter's outputs, the first the regulated one.
    #[serde(default)]
    pub output: Vec<Spanned<OutputRaw>>,
    pub material: Option<Spanned<MaterialRaw>>,
    pub isolation: Option<Spanned<IsolationRaw>>,
    /// `[measured]`: the bench readings of the wound part (see `files::measured`).
    pub measured: Option<Spanned<super::measured::MeasuredTable>>,
}

/// `[isolation]`: the declared class between primary and secondary sides.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct IsolationRaw {
    pub class: Spanned<String>,
    pub working_voltage_v: Option<Spanned<f64>>,
    pub creepage_mm: Option<Spanned<f64>>,
}

/// `bobbin = "id"` or an inline `[bobbin]` table.
#[derive(Debug)]
pub enum BobbinField {
    Id(String),
    Inline(Box<BobbinBody>),
}

impl<'de> Deserialize<'de> for BobbinField {
    fn deserialize<D: de::Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl<'de> Visitor<'de> for V {
            type Value = BobbinField;
            fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
                f.write_str(
                    "a bobbin id like \"e25-13-7\" or a [bobbin] table with window and tube",
                )
            }
            fn visit_str<E: de::Error>(self, v: &str) -> Result<Self::Value, E> {
                Ok(BobbinField::Id(v.to_string()))
            }
            fn visit_map<A: MapAccess<'de>>(self, map: A) -> Result<Self::Value, A::Error> {
                BobbinBody::deserialize(de::value::MapAccessDeserializer::new(map))
                    .map(|b| BobbinField::Inline(Box::new(b)))
            }
        }
        d.deserialize_any(V)
    }
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SetupRaw {
    pub temperature_c: Option<Spanned<f64>>,
    /// The hand-winding allowance factor (the model's `Setup::allowance_factor`).
    pub bulge: Option<Spanned<f64>>,
    pub margin_mm: Option<Spanned<f64>>,
    pub tape_mm: Option<Spanned<f64>>,
    pub frequency_khz: Option<Spanned<f64>>,
    pub wire_class_c: Option<Spanned<f64>>,
    pub tape_class_c: Option<Spanned<f64>>,
    pub bobbin_class_c: Option<Spanned<f64>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WindingRaw {
    pub name: Spanned<String>,
    pub role: Spanned<String>,
    pub turns: Spanned<u32>,
    pub wire: Spanned<WireField>,
    pub insulation: Option<Spanned<String>>,
    pub strands: Option<Spanned<u32>>,
    pub current_rms_a: Option<Spanned<f64>>,
    pub start_pin: Option<PinLabel>,
    pub finish_pin: Option<PinLabel>,
}

/// A pin label: written as a string, a bare number is accepted too.
#[derive(Debug)]
pub struct PinLabel(pub String);

impl<'de> Deserialize<'de> for PinLabel {
    fn deserialize<D: de::Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl Visitor<'_> for V {
            type Value = PinLabel;
            fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
                f.write_str("a pin label such as \"1\" or \"A2\"")
            }
            fn visit_str<E: de::Error>(self, v: &str) -> Result<Self::Value, E> {
                Ok(PinLabel(v.to_string()))
            }
            fn visit_i64<E: de::Error>(self, v: i64) -> Result<Self::Value, E> {
                Ok(PinLabel(v.to_string()))
            }
        }
        d.deserialize_any(V)
    }
}

/// `"awg27"`, `"0.355mm"`, `{ bare_mm = 0.40, od_mm = 0.452 }`, a foil
/// `{ foil_mm = 0.2, ... }` or a litz `{ litz_strands = 60, strand_mm = 0.1, ... }`.
#[derive(Debug)]
pub enum WireField {
    Named(String),
    Measured { bare_mm: f64, od_mm: f64 },
    Foil(crate::model::Foil),
    Litz(crate::model::Litz),
}

/// Every key an inline wire table may have; which are present decides the kind.
#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct WireTableRaw {
    bare_mm: Option<f64>,
    od_mm: Option<f64>,
    foil_mm: Option<f64>,
    width_mm: Option<f64>,
    interleaf_mm: Option<f64>,
    overhang_mm: Option<f64>,
    tab_mm: Option<f64>,
    litz_strands: Option<u32>,
    strand_mm: Option<f64>,
    serving_mm: Option<f64>,
    packing: Option<f64>,
    lay_factor: Option<f64>,
}

impl WireTableRaw {
    /// The keys present that belong to none of `allowed`.
    fn stray(&self, allowed: &[&str]) -> Option<&'static str> {
        let present = [
            ("bare_mm", self.bare_mm.is_some()),
            ("od_mm", self.od_mm.is_some()),
            ("foil_mm", self.foil_mm.is_some()),
            ("width_mm", self.width_mm.is_some()),
            ("interleaf_mm", self.interleaf_mm.is_some()),
            ("overhang_mm", self.overhang_mm.is_some()),
            ("tab_mm", self.tab_mm.is_some()),
            ("litz_strands", self.litz_strands.is_some()),
            ("strand_mm", self.strand_mm.is_some()),
            ("serving_mm", self.serving_mm.is_some()),
            ("packing", self.packing.is_some()),
            ("lay_factor", self.lay_factor.is_some()),
        ];
        present
            .into_iter()
            .find(|(k, p)| *p && !allowed.contains(k))
            .map(|(k, _)| k)
    }

    fn into_field<E: de::Error>(self) -> Result<WireField, E> {
        const FOIL: [&str; 5] = [
            "foil_mm",
            "width_mm",
            "interleaf_mm",
            "overhang_mm",
            "tab_mm",
        ];
        const LITZ: [&str; 5] = [
            "litz_strands",
            "strand_mm",
            "serving_mm",
            "packing",
            "lay_factor",
        ];
        let mixed = |kind: &str, k: &str| {
            E::custom(format!("\"{k}\" does not belong in a {kind} wire table"))
        };
        if let Some(t) = self.foil_mm {
            if let Some(k) = self.stray(&FOIL) {
                return Err(mixed("foil", k));
            }
            return Ok(WireField::Foil(crate::model::Foil {
                thickness_mm: t,
                width_mm: self.width_mm,
                interleaf_mm: self.interleaf_mm,
                overhang_mm: self.overhang_mm,
                tab_mm: self.tab_mm,
            }));
        }
        if self.litz_strands.is_some() || self.strand_mm.is_some() {
            if let Some(k) = self.stray(&LITZ) {
                return Err(mixed("litz", k));
            }
            let (Some(n), Some(d)) = (self.litz_strands, self.strand_mm) else {
                return Err(E::custom(
                    "a litz wire needs both litz_strands and strand_mm, e.g. { litz_strands = 60, strand_mm = 0.1 }",
                ));
            };
            return Ok(WireField::Litz(crate::model::Litz {
                strands: n,
                strand_mm: d,
                serving_mm: self.serving_mm,
                packing: self.packing,
                lay_factor: self.lay_factor,
            }));
        }
        match (self.bare_mm, self.od_mm, self.stray(&["bare_mm", "od_mm"])) {
            (Some(bare_mm), Some(od_mm), None) => Ok(WireField::Measured { bare_mm, od_mm }),
            (_, _, Some(k)) => Err(E::custom(format!(
                "\"{k}\" needs foil_mm (a foil) or litz_strands and strand_mm (a litz)"
            ))),
            _ => Err(E::custom(
                "a measured wire needs both bare_mm and od_mm, e.g. { bare_mm = 0.40, od_mm = 0.452 }",
            )),
        }
    }
}

impl<'de> Deserialize<'de> for WireField {
    fn deserialize<D: de::Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl<'de> Visitor<'de> for V {
            type Value = WireField;
            fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
                f.write_str(
                    "a wire like \"awg27\", \"0.355mm\", { bare_mm = 0.40, od_mm = 0.452 }, \
                     { foil_mm = 0.2 } or { litz_strands = 60, strand_mm = 0.1 }",
                )
            }
            fn visit_str<E: de::Error>(self, v: &str) -> Result<Self::Value, E> {
                Ok(WireField::Named(v.to_string()))
            }
            fn visit_map<A: MapAccess<'de>>(self, map: A) -> Result<Self::Value, A::Error> {
                WireTableRaw::deserialize(de::value::MapAccessDeserializer::new(map))?.into_field()
            }
        }
        d.deserialize_any(V)
    }
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SectionRaw {
    pub winding: Option<Spanned<String>>,
    pub turns: Option<Spanned<u32>>,
    /// The bifilar partner (the model's `WindingSection::partner`).
    pub with: Option<Spanned<String>>,
    pub layer_tape: Option<Spanned<u32>>,
    /// The last layer space-wound (the model's `WindingSection::spread`).
    pub spread: Option<Spanned<bool>>,
    pub tape: Option<Spanned<u32>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct OperatingRaw {
    pub converter: Option<Spanned<String>>,
    pub reset_side: Option<Spanned<String>>,
    pub vin_min_v: Spanned<f64>,
    pub vin_max_v: Spanned<f64>,
    /// Required without `[[output]]` tables (the one-output shorthand).
    pub vout_v: Option<Spanned<f64>>,
    pub iout_a: Option<Spanned<f64>>,
    pub rectifier_drop_v: Option<Spanned<f64>>,
    pub duty_limit: Option<Spanned<f64>>,
    pub rise_limit_c: Option<Spanned<f64>>,
    pub surface_area_cm2: Option<Spanned<f64>>,
    pub switch_drop_v: Option<Spanned<f64>>,
    pub ambient_c: Option<Spanned<f64>>,
    pub switch_rating_v: Option<Spanned<f64>>,
}

/// One `[[output]]` table.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct OutputRaw {
    pub name: Spanned<String>,
    pub vout_v: Spanned<f64>,
    pub iout_a: Spanned<f64>,
    pub rectifier_drop_v: Option<Spanned<f64>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MaterialRaw {
    /// A generic ferrite from the bundled library (the model's `Material::ferrite`); explicit
    /// keys override its values.
    pub grade: Option<Spanned<String>>,
    pub bsat_mt: Option<Spanned<f64>>,
    pub br_mt: Option<Spanned<f64>>,
    pub mu_i: Option<Spanned<f64>>,
    pub steinmetz: Option<Spanned<SteinmetzRaw>>,
    pub gap_mm: Option<Spanned<f64>>,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SteinmetzRaw {
    pub k: f64,
    pub alpha: f64,
    pub beta: f64,
}
