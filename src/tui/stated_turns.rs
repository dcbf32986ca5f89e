//! Which stack sections state their turns in the file and which take what is left of their
//! winding: the planner's edits write turns in only where the edit needs them.

use super::edit::Refusal;
use crate::model::{Build, Section};

/// Write every winding section's resolved turns into it, so that moving sections around
/// cannot change which section gets "what is left".
pub(super) fn pin_turns(b: &mut Build) {
    let turns = b.section_turns();
    for (s, t) in b.stack.iter_mut().zip(turns) {
        if let Section::Winding(ws) = s {
            ws.turns = Some(t);
        }
    }
}

/// Make a turn edit `f` on a copy with every section's turns written in, then carry its
/// turns over to `b`, writing a section's turns only where needed: the `edited` section,
/// sections that already state theirs, and a section that would otherwise come out
/// different. A section that takes what is left of its winding keeps doing so while that
/// gives it the turns the edit meant, so the file keeps saying "the rest" where it did.
pub(super) fn turn_edit(
    b: &mut Build,
    edited: Option<usize>,
    f: impl FnOnce(&mut Build) -> Result<(), Refusal>,
) -> Result<(), Refusal> {
    let mut p = b.clone();
    pin_turns(&mut p);
    f(&mut p)?;
    let want = p.section_turns();
    for (w, pw) in b.windings.iter_mut().zip(&p.windings) {
        w.turns = pw.turns;
    }
    for (i, (s, &t)) in b.stack.iter_mut().zip(&want).enumerate() {
        if let Section::Winding(ws) = s
            && (ws.turns.is_some() || edited == Some(i))
        {
            ws.turns = Some(t);
        }
    }
    // Each pass writes in the turns of the first section that still comes out different.
    while let Some(i) = b
        .section_turns()
        .iter()
        .zip(&want)
        .position(|(a, w)| a != w)
    {
        match b.stack.get_mut(i) {
            Some(Section::Winding(s)) if s.turns.is_none() => s.turns = Some(want[i]),
            _ => break,
        }
    }
    Ok(())
}
