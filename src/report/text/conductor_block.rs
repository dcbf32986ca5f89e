//! The text report's block of foil and litz figures; absent when every winding is round wire.

use crate::engine::Evaluation;
use crate::engine::conductor::ConductorFigures;
use std::fmt::Write as _;

/// Each foil and litz winding's own figures (see FORMAT.md, "Foil and litz").
pub(super) fn conductor_block(o: &mut String, eval: &Evaluation) {
    if eval
        .windings
        .iter()
        .all(|w| w.conductor == ConductorFigures::Round)
    {
        return;
    }
    let _ = writeln!(o, "\nFoil and litz");
    for w in &eval.windings {
        let name = crate::report::textfmt::truncate(&w.name, 6);
        match w.conductor {
            ConductorFigures::Round => {}
            ConductorFigures::Foil {
                thickness_mm,
                width_mm,
                interleaf_mm,
                layer_height_mm,
                porosity,
            } => {
                let _ = writeln!(
                    o,
                    "  {name:<6} foil {thickness_mm:.3} x {width_mm:.2} mm ({:.3} mm2), interleaf {interleaf_mm:.3} mm",
                    w.copper_area_mm2
                );
                let _ = writeln!(
                    o,
                    "         one turn a layer, {layer_height_mm:.3} mm a layer; porosity {porosity:.3} (Dowell)"
                );
            }
            ConductorFigures::Litz {
                strands,
                strand_mm,
                strand_od_mm,
                bundle_mm,
                od_mm,
                packing,
                lay_factor,
                strand_over_skin,
            } => {
                let _ = writeln!(
                    o,
                    "  {name:<6} litz {strands} x {strand_mm:.3} mm (od {strand_od_mm:.3}), {:.3} mm2, bundle {bundle_mm:.2} mm, {od_mm:.2} mm served",
                    w.copper_area_mm2
                );
                let skin = strand_over_skin.map_or(String::new(), |x| {
                    format!("; strand {x:.2} skin depths (Sullivan 1999)")
                });
                let _ = writeln!(
                    o,
                    "         packing {packing:.2}, lay factor {lay_factor:.3}{skin}"
                );
            }
        }
    }
}
