//! Wire tables: AWG bare diameters (ASTM B258), metric nominal sizes with IEC 60317-0-1 maximum
//! overall diameters per grade, and triple-insulated wire. Data and lookups only, no resistance.
//!
//! Sizes that are not table rows (AWG gauges, metric sizes between rows) take the bare diameter
//! plus the grade's insulation increase (max overall minus nominal) of the next larger row; above
//! the largest row (AWG 10-12) the largest row's increase. A size equal to a row gets the row's
//! value exactly. Chosen over interpolation because, with the rows held here, it reproduces the
//! intermediate rows of the standard's national adoption (IS 13730-0-1) to 0.002 mm, where
//! interpolation comes out up to 0.007 mm too thin; for fitting layers thicker is safer.

use crate::model::{Insulation, WireSize};

/// Gauges the bundled AWG table holds.
pub const AWG_RANGE: std::ops::RangeInclusive<u32> = 10..=44;

/// One line on how overall diameters of sizes that are not table rows are found, for listings.
pub const INTERMEDIATE_RULE: &str = "sizes between IEC 60317-0-1 rows (and AWG sizes) take the \
    bare diameter plus the insulation increase of the next larger row; above 2.000 mm the \
    2.000 mm row's increase";

/// A bare diameter this close to a table row's nominal is that row: file values such as
/// "0.5mm" parse to the same f64 as the row, the tolerance only absorbs arithmetic noise.
pub const ROW_MATCH_MM: f64 = 1e-9;

/// Radial build of triple-insulated wire taken twice: overall = bare + 0.2 mm. Typical, from
/// memory (three extruded layers of about 0.03-0.04 mm each); makers' figures vary by size.
pub const TIW_INCREASE_MM: f64 = 0.2;

/// ASTM B258: No. 36 AWG is 0.0050 in (0.127 mm); successive gauges share the ratio 92^(1/39).
const AWG36_MM: f64 = 0.127;

/// A wire with its diameters resolved.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ResolvedWire {
    pub bare_mm: f64,
    pub od_mm: f64,
}

/// One metric row of the table.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MetricRow {
    pub nominal_mm: f64,
    /// Maximum overall diameter for grade 1, 2, 3.
    pub od_max_mm: [f64; 3],
    /// True where the row's three maximum diameters were read in a copy of the standard's
    /// table; false where they are from memory (plausible, monotonic, but unverified).
    pub confirmed: bool,
}

/// One line of the wire listing (`turnstack wires`, the wire picker).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CatalogueRow {
    pub size: WireSize,
    pub bare_mm: f64,
    /// Overall diameter for grade 1, grade 2, grade 3 and triple-insulated wire.
    pub od_mm: [f64; 4],
    /// True only for metric rows whose enamel diameters are confirmed (see [`MetricRow`]).
    pub confirmed: bool,
}

const fn row(nominal_mm: f64, g1: f64, g2: f64, g3: f64, confirmed: bool) -> MetricRow {
    MetricRow {
        nominal_mm,
        od_max_mm: [g1, g2, g3],
        confirmed,
    }
}

/// IEC 60317-0-1, Table 1: nominal conductor diameter (the R20-based series of preferred sizes,
/// 0.050 to 2.000 mm) and maximum overall diameter for grades 1, 2 and 3, in mm, as tabulated.
/// Rows with `true` were read in reproductions of the table (IS 13730-0-1, the Indian adoption
/// with the same numbers); all others are from memory and need checking against the standard.
const METRIC_ROWS: [MetricRow; 33] = [
    row(0.050, 0.060, 0.065, 0.070, false), // from memory
    row(0.056, 0.067, 0.072, 0.077, false), // from memory
    row(0.063, 0.076, 0.081, 0.086, false), // from memory
    row(0.071, 0.084, 0.090, 0.095, false), // from memory
    row(0.080, 0.094, 0.101, 0.107, false), // from memory
    row(0.090, 0.105, 0.113, 0.119, false), // from memory
    row(0.100, 0.117, 0.125, 0.132, true),
    row(0.112, 0.130, 0.139, 0.147, true),
    row(0.125, 0.144, 0.154, 0.163, true),
    row(0.140, 0.160, 0.171, 0.181, false), // from memory
    row(0.160, 0.182, 0.194, 0.205, true),
    row(0.180, 0.204, 0.217, 0.229, false), // from memory
    row(0.200, 0.226, 0.239, 0.252, false), // from memory
    row(0.224, 0.252, 0.266, 0.280, false), // from memory
    row(0.250, 0.281, 0.297, 0.312, false), // from memory
    row(0.280, 0.312, 0.329, 0.345, false), // from memory
    row(0.315, 0.349, 0.367, 0.384, true),
    row(0.355, 0.392, 0.411, 0.428, false), // from memory
    row(0.400, 0.439, 0.459, 0.478, false), // from memory
    row(0.450, 0.491, 0.513, 0.533, false), // from memory
    row(0.500, 0.544, 0.566, 0.587, false), // from memory
    row(0.560, 0.606, 0.630, 0.653, false), // from memory
    row(0.630, 0.679, 0.704, 0.728, false), // from memory
    row(0.710, 0.762, 0.789, 0.814, false), // from memory
    row(0.800, 0.855, 0.884, 0.911, false), // from memory
    row(0.900, 0.959, 0.989, 1.018, false), // from memory
    row(1.000, 1.062, 1.094, 1.124, false), // from memory
    row(1.120, 1.184, 1.217, 1.248, false), // from memory
    row(1.250, 1.316, 1.349, 1.381, false), // from memory
    row(1.400, 1.468, 1.502, 1.535, false), // from memory
    row(1.600, 1.670, 1.706, 1.740, false), // from memory
    row(1.800, 1.872, 1.909, 1.944, false), // from memory
    row(2.000, 2.074, 2.112, 2.148, false), // from memory
];

/// ASTM B258 table of nominal diameters in inches, AWG 10..=44, as the standard prints them
/// (4 significant figures, 0.0001 in resolution). Kept as data to show where it departs from
/// the formula; the program itself uses the unrounded formula, as the build format says.
const AWG_B258_TABLE_IN: [f64; 35] = [
    0.1019, 0.0907, 0.0808, 0.0720, 0.0641, 0.0571, 0.0508, 0.0453, 0.0403, 0.0359, // 10-19
    0.0320, 0.0285, 0.0253, 0.0226, 0.0201, 0.0179, 0.0159, 0.0142, 0.0126, 0.0113, // 20-29
    0.0100, 0.0089, 0.0080, 0.0071, 0.0063, 0.0056, 0.0050, 0.0045, 0.0040, 0.0035, // 30-39
    0.0031, 0.0028, 0.0025, 0.0022, 0.0020, // 40-44
];

/// Millimetres per inch (exact by definition, international inch of 1959).
const MM_PER_IN: f64 = 25.4;

/// ASTM B258: d = 0.127 mm x 92^((36 - n)/39), unrounded.
pub fn awg_bare_mm(gauge: u32) -> f64 {
    AWG36_MM * 92f64.powf((36.0 - f64::from(gauge)) / 39.0)
}

/// The ASTM B258 rounded table value in mm for a gauge in [`AWG_RANGE`]; `None` outside it.
/// For comparison only: AWG 38 and 40 differ from the formula by about 1 %.
pub fn awg_b258_table_mm(gauge: u32) -> Option<f64> {
    let i = usize::try_from(gauge.checked_sub(*AWG_RANGE.start())?).ok()?;
    AWG_B258_TABLE_IN.get(i).map(|d_in| d_in * MM_PER_IN)
}

/// The metric rows, smallest first.
pub fn metric_rows() -> &'static [MetricRow] {
    &METRIC_ROWS
}

pub fn bare_mm(size: &WireSize) -> f64 {
    match *size {
        WireSize::Awg(n) => awg_bare_mm(n),
        WireSize::Metric { bare_mm } | WireSize::Measured { bare_mm, .. } => bare_mm,
    }
}

/// Overall diameter of a named wire of this bare diameter.
///
/// Grades 1-3: the IEC 60317-0-1 maximum overall diameter for a table row; for any other size
/// the bare diameter plus the grade's increase (max OD minus nominal) of the next larger row,
/// or of the largest row above the table. Triple-insulated: bare + [`TIW_INCREASE_MM`].
pub fn overall_mm(bare_mm: f64, insulation: Insulation) -> f64 {
    let grade = match insulation {
        Insulation::Grade1 => 0,
        Insulation::Grade2 => 1,
        Insulation::Grade3 => 2,
        Insulation::Tiw => return bare_mm + TIW_INCREASE_MM,
    };
    if let Some(r) = METRIC_ROWS
        .iter()
        .find(|r| (r.nominal_mm - bare_mm).abs() <= ROW_MATCH_MM)
    {
        return r.od_max_mm[grade];
    }
    // Next larger row: the intermediate rows of the standard's national adoption carry the
    // next larger size's increase, and it is the thicker (safer) choice for fitting layers.
    let r = METRIC_ROWS
        .iter()
        .find(|r| r.nominal_mm > bare_mm)
        .unwrap_or(&METRIC_ROWS[METRIC_ROWS.len() - 1]);
    bare_mm + (r.od_max_mm[grade] - r.nominal_mm)
}

/// Overall diameter of an AWG gauge by the rule of [`overall_mm`].
pub fn awg_overall_mm(gauge: u32, insulation: Insulation) -> f64 {
    overall_mm(awg_bare_mm(gauge), insulation)
}

/// Bare and overall diameter; a measured wire's `od_mm` always wins over any table.
pub fn resolve(size: &WireSize, insulation: Insulation) -> ResolvedWire {
    let bare = bare_mm(size);
    let od = match *size {
        WireSize::Measured { od_mm, .. } => od_mm,
        WireSize::Awg(_) | WireSize::Metric { .. } => overall_mm(bare, insulation),
    };
    ResolvedWire {
        bare_mm: bare,
        od_mm: od,
    }
}

/// Every named size the program knows: AWG 10..=44 in gauge order, then the metric rows
/// smallest first, each with its overall diameter for the four insulations.
pub fn catalogue() -> Vec<CatalogueRow> {
    let line = |size: WireSize, confirmed: bool| {
        let bare = bare_mm(&size);
        CatalogueRow {
            size,
            bare_mm: bare,
            od_mm: Insulation::ALL.map(|ins| overall_mm(bare, ins)),
            confirmed,
        }
    };
    AWG_RANGE
        .map(|n| line(WireSize::Awg(n), false))
        .chain(METRIC_ROWS.iter().map(|r| {
            line(
                WireSize::Metric {
                    bare_mm: r.nominal_mm,
                },
                r.confirmed,
            )
        }))
        .collect()
}
