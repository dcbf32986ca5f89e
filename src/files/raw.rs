//! The file shapes exactly as written (serde types with spans), before they become the model.

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

/// `"awg27"`, `"0.355mm"` or `{ bare_mm = 0.40, od_mm = 0.452 }`.
#[derive(Debug)]
pub enum WireField {
    Named(String),
    Measured { bare_mm: f64, od_mm: f64 },
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct MeasuredRaw {
    bare_mm: f64,
    od_mm: f64,
}

impl<'de> Deserialize<'de> for WireField {
    fn deserialize<D: de::Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        struct V;
        impl<'de> Visitor<'de> for V {
            type Value = WireField;
            fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
                f.write_str(
                    "a wire like \"awg27\", \"0.355mm\" or { bare_mm = 0.40, od_mm = 0.452 }",
                )
            }
            fn visit_str<E: de::Error>(self, v: &str) -> Result<Self::Value, E> {
                Ok(WireField::Named(v.to_string()))
            }
            fn visit_map<A: MapAccess<'de>>(self, map: A) -> Result<Self::Value, A::Error> {
                let m = MeasuredRaw::deserialize(de::value::MapAccessDeserializer::new(map))?;
                Ok(WireField::Measured {
                    bare_mm: m.bare_mm,
                    od_mm: m.od_mm,
                })
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
    pub with: Option<Spanned<String>>,
    pub layer_tape: Option<Spanned<u32>>,
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
    /// A generic grade from the bundled library; explicit keys override its values.
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
