//! The edits the planner makes to a Build: plain changes to the model, no figures. Each
//! returns a message when it cannot be done; `App` then runs the engine's validation on the
//! result before accepting it.

use crate::model::{
    BobbinSource, Build, Insulation, Role, Section, Setup, Winding, WindingSection, WireSize,
};

use super::stated_turns::{pin_turns, turn_edit};

/// A refused edit, in words for the status line.
pub type Refusal = String;

fn ws(b: &Build, i: usize) -> Option<&WindingSection> {
    match b.stack.get(i) {
        Some(Section::Winding(w)) => Some(w),
        _ => None,
    }
}

fn ws_mut(b: &mut Build, i: usize) -> Option<&mut WindingSection> {
    match b.stack.get_mut(i) {
        Some(Section::Winding(w)) => Some(w),
        _ => None,
    }
}

fn turns_of(b: &Build, i: usize) -> u32 {
    ws(b, i).and_then(|w| w.turns).unwrap_or(0)
}

/// Same winding and same bifilar partner, in either order.
fn same_pair(a: &WindingSection, c: &WindingSection) -> bool {
    (a.winding == c.winding && a.partner == c.partner)
        || (a.partner.as_deref() == Some(c.winding.as_str())
            && c.partner.as_deref() == Some(a.winding.as_str()))
}

/// Other sections wound with the same pair as section `i`, nearest first.
fn siblings(b: &Build, i: usize) -> Vec<usize> {
    let Some(me) = ws(b, i) else {
        return Vec::new();
    };
    let mut v: Vec<usize> = (0..b.stack.len())
        .filter(|&j| j != i && ws(b, j).is_some_and(|o| same_pair(me, o)))
        .collect();
    v.sort_by_key(|&j| (j.abs_diff(i), j));
    v
}

/// Sections that wind `name` alone, nearest to `near` first.
fn plain_sections(b: &Build, name: &str, near: usize) -> Vec<usize> {
    let mut v: Vec<usize> = (0..b.stack.len())
        .filter(|&j| ws(b, j).is_some_and(|o| o.winding == name && o.partner.is_none()))
        .collect();
    v.sort_by_key(|&j| (j.abs_diff(near), j));
    v
}

fn label(s: &WindingSection) -> String {
    match &s.partner {
        Some(w) => format!("{}+{w}", s.winding),
        None => s.winding.clone(),
    }
}

/// Insert a tape section of one wrap at `at`.
pub fn add_tape(b: &mut Build, at: usize) -> Result<usize, Refusal> {
    let at = at.min(b.stack.len());
    b.stack.insert(at, Section::Tape { wraps: 1 });
    Ok(at)
}

/// Insert at `at` a section of `winding` that takes half the turns of its outermost section
/// of its own.
pub fn add_share(b: &mut Build, at: usize, winding: &str) -> Result<usize, Refusal> {
    pin_turns(b);
    let from = (0..b.stack.len())
        .rev()
        .find(|&j| ws(b, j).is_some_and(|o| o.winding == winding))
        .ok_or_else(|| format!("\"{winding}\" has no section to take turns from"))?;
    let t = turns_of(b, from);
    if t < 2 {
        return Err(format!(
            "the outermost section of \"{winding}\" has {t} turn: nothing to share"
        ));
    }
    let half = t / 2;
    let mut new = ws(b, from)
        .cloned()
        .unwrap_or_else(|| unreachable_section(winding));
    new.turns = Some(half);
    if let Some(s) = ws_mut(b, from) {
        s.turns = Some(t - half);
    }
    let at = at.min(b.stack.len());
    b.stack.insert(at, Section::Winding(new));
    Ok(at)
}

fn unreachable_section(winding: &str) -> WindingSection {
    WindingSection {
        winding: winding.to_string(),
        turns: None,
        partner: None,
        layer_tape: 0,
        spread: false,
    }
}

/// Remove a section; a winding section's turns go to the nearest other section wound with
/// the same pair. Returns the index to select afterwards.
pub fn delete_section(b: &mut Build, i: usize) -> Result<usize, Refusal> {
    if i >= b.stack.len() {
        return Err("no section selected".into());
    }
    pin_turns(b);
    if ws(b, i).is_some() {
        let t = turns_of(b, i);
        if let Some(&j) = siblings(b, i).first()
            && let Some(s) = ws_mut(b, j)
        {
            s.turns = Some(s.turns.unwrap_or(0) + t);
        }
    }
    b.stack.remove(i);
    Ok(i.min(b.stack.len().saturating_sub(1)))
}

/// Swap a section with its neighbour outward (`outward`) or inward.
pub fn move_section(b: &mut Build, i: usize, outward: bool) -> Result<usize, Refusal> {
    let j = if outward {
        if i + 1 >= b.stack.len() {
            return Err("this is already the outermost section".into());
        }
        i + 1
    } else {
        if i == 0 {
            return Err("this is already the section next to the tube".into());
        }
        i - 1
    };
    pin_turns(b);
    b.stack.swap(i, j);
    Ok(j)
}

/// Split winding section `x` into halves around section `y`: the half nearer the tube stays
/// (or goes) inside `y`, the other half outside it, and the tape wraps that separated `x`
/// from its neighbour toward `y` are copied to the other side. Returns the new index of `y`.
pub fn split_around(b: &mut Build, x: usize, y: usize) -> Result<usize, Refusal> {
    let (Some(sx), Some(sy)) = (ws(b, x), ws(b, y)) else {
        return Err("split needs two winding sections".into());
    };
    if sx.winding == sy.winding || Some(&sy.winding) == sx.partner.as_ref() {
        return Err(format!(
            "\"{}\" cannot be split around a section of its own winding",
            label(sx)
        ));
    }
    pin_turns(b);
    let t = turns_of(b, x);
    if t < 2 {
        return Err(format!("section has {t} turn: nothing to split"));
    }
    let inner = t.div_ceil(2);
    let outer = t - inner;
    let mut half = ws(b, x).cloned().unwrap_or_else(|| unreachable_section(""));
    if x < y {
        // Tapes directly outside x.
        let tapes: Vec<Section> = b.stack[x + 1..]
            .iter()
            .take_while(|s| matches!(s, Section::Tape { .. }))
            .cloned()
            .collect();
        if let Some(s) = ws_mut(b, x) {
            s.turns = Some(inner);
        }
        half.turns = Some(outer);
        let mut insert: Vec<Section> = tapes;
        insert.push(Section::Winding(half));
        b.stack.splice(y + 1..y + 1, insert);
        Ok(y)
    } else {
        // Tapes directly inside x.
        let mut tapes: Vec<Section> = b.stack[..x]
            .iter()
            .rev()
            .take_while(|s| matches!(s, Section::Tape { .. }))
            .cloned()
            .collect();
        tapes.reverse();
        if let Some(s) = ws_mut(b, x) {
            s.turns = Some(outer);
        }
        half.turns = Some(inner);
        let n = tapes.len() + 1;
        let mut insert = vec![Section::Winding(half)];
        insert.extend(tapes);
        b.stack.splice(y..y, insert);
        Ok(y + n)
    }
}

/// Set a section's turns; the difference goes to the nearest other section of the same pair,
/// or, when there is none, to the winding's (and its partner's) total. The section states
/// its turns from then on; the others keep stating theirs or not (see `turn_edit`).
pub fn set_section_turns(b: &mut Build, i: usize, n: u32) -> Result<(), Refusal> {
    if n == 0 {
        return Err("a section needs at least 1 turn".into());
    }
    turn_edit(b, Some(i), |b| section_turns_pinned(b, i, n))
}

/// `set_section_turns` on a build whose sections all state their turns.
fn section_turns_pinned(b: &mut Build, i: usize, n: u32) -> Result<(), Refusal> {
    let old = turns_of(b, i);
    let Some(me) = ws(b, i).cloned() else {
        return Err("not a winding section".into());
    };
    match siblings(b, i).first() {
        Some(&j) => {
            let other = i64::from(turns_of(b, j)) + i64::from(old) - i64::from(n);
            if other < 1 {
                return Err(format!(
                    "the other section of {} has only {} turns to give",
                    label(&me),
                    turns_of(b, j)
                ));
            }
            if let Some(s) = ws_mut(b, j) {
                s.turns = Some(other as u32);
            }
        }
        None => {
            for name in std::iter::once(&me.winding).chain(me.partner.as_ref()) {
                if let Some(w) = b.windings.iter_mut().find(|w| &w.name == name) {
                    let t = i64::from(w.turns) + i64::from(n) - i64::from(old);
                    w.turns = u32::try_from(t.max(0)).unwrap_or(0);
                }
            }
        }
    }
    if let Some(s) = ws_mut(b, i) {
        s.turns = Some(n);
    }
    Ok(())
}

/// Wind section `i` bifilar with `partner` (or alone with `None`). The partner's turns come
/// from its own sections (nearest first, emptied ones removed) and go back to them (or to a
/// new section of its own, outermost on a wrap of tape) when the pairing ends. Returns the section's new index.
pub fn set_partner(b: &mut Build, i: usize, partner: Option<&str>) -> Result<usize, Refusal> {
    let Some(me) = ws(b, i).cloned() else {
        return Err("only a winding section can be wound bifilar".into());
    };
    if me.partner.as_deref() == partner {
        return Ok(i);
    }
    if partner == Some(me.winding.as_str()) {
        return Err(format!(
            "\"{}\" cannot be wound bifilar with itself",
            me.winding
        ));
    }
    pin_turns(b);
    let t = turns_of(b, i);
    let mut i = i;
    if let Some(old) = &me.partner {
        if let Some(s) = ws_mut(b, i) {
            s.partner = None;
        }
        match plain_sections(b, old, i).first() {
            Some(&j) => {
                if let Some(s) = ws_mut(b, j) {
                    s.turns = Some(s.turns.unwrap_or(0) + t);
                }
            }
            None => {
                // Its own section, outermost, on a wrap of tape.
                wind_outermost(b, old.clone(), Some(t));
            }
        }
    }
    if let Some(p) = partner {
        if b.winding(p).is_none() {
            return Err(format!("there is no winding \"{p}\""));
        }
        let have: u32 = plain_sections(b, p, i)
            .iter()
            .map(|&j| turns_of(b, j))
            .sum();
        if have < t {
            return Err(format!(
                "\"{p}\" has {have} turns in sections of its own; winding it with this section needs {t}"
            ));
        }
        let mut need = t;
        for j in plain_sections(b, p, i) {
            if need == 0 {
                break;
            }
            let here = turns_of(b, j);
            let take = here.min(need);
            need -= take;
            if let Some(s) = ws_mut(b, j) {
                s.turns = Some(here - take);
            }
        }
        // Drop the sections emptied, keeping track of where section i went.
        let mut k = 0;
        let mut removed_before = 0;
        b.stack.retain(|s| {
            let keep = !matches!(s, Section::Winding(w) if w.turns == Some(0));
            if !keep && k < i {
                removed_before += 1;
            }
            k += 1;
            keep
        });
        i -= removed_before;
        if let Some(s) = ws_mut(b, i) {
            s.partner = Some(p.to_string());
        }
    }
    Ok(i)
}

pub fn set_wraps(b: &mut Build, i: usize, wraps: u32) -> Result<(), Refusal> {
    match b.stack.get_mut(i) {
        Some(Section::Tape { wraps: w }) => {
            if wraps == 0 {
                return Err("a tape section needs at least 1 wrap (delete it instead)".into());
            }
            *w = wraps;
            Ok(())
        }
        Some(Section::Winding(ws)) => {
            ws.layer_tape = wraps;
            Ok(())
        }
        None => Err("no section selected".into()),
    }
}

/// Space a winding section's last layer across the width (`spread`), or close-wind it.
pub fn set_spread(b: &mut Build, i: usize, spread: bool) -> Result<(), Refusal> {
    match b.stack.get_mut(i) {
        Some(Section::Winding(ws)) => {
            ws.spread = spread;
            Ok(())
        }
        Some(Section::Tape { .. }) => Err("a tape section has no layers to space".into()),
        None => Err("no section selected".into()),
    }
}

/// Current wraps of a tape section, or the tape between the layers of a winding section.
pub fn wraps_of(b: &Build, i: usize) -> u32 {
    match b.stack.get(i) {
        Some(Section::Tape { wraps }) => *wraps,
        Some(Section::Winding(ws)) => ws.layer_tape,
        None => 0,
    }
}

pub fn rename(b: &mut Build, k: usize, new: &str) -> Result<(), Refusal> {
    let new = new.trim();
    if new.is_empty() {
        return Err("a winding needs a name".into());
    }
    if b.windings
        .iter()
        .enumerate()
        .any(|(j, w)| j != k && w.name == new)
    {
        return Err(format!("another winding is already called \"{new}\""));
    }
    let old = std::mem::replace(&mut b.windings[k].name, new.into());
    for s in &mut b.stack {
        if let Section::Winding(ws) = s {
            if ws.winding == old {
                ws.winding = new.to_string();
            }
            if ws.partner.as_deref() == Some(old.as_str()) {
                ws.partner = Some(new.to_string());
            }
        }
    }
    Ok(())
}

/// Set a winding's turns; the difference goes to its section of its own that takes what is
/// left (as the file says), or, when each states its turns, to the outermost one. No other
/// section is made to state its turns (see `turn_edit`).
pub fn set_winding_turns(b: &mut Build, k: usize, n: u32) -> Result<(), Refusal> {
    if n == 0 {
        return Err("a winding needs at least 1 turn".into());
    }
    let name = b.windings[k].name.clone();
    let rest = plain_sections(b, &name, usize::MAX)
        .into_iter()
        .find(|&j| ws(b, j).is_some_and(|o| o.turns.is_none()));
    turn_edit(b, None, |b| winding_turns_pinned(b, k, n, rest))
}

/// `set_winding_turns` on a build whose sections all state their turns; `rest` is the
/// section that took what was left of the winding, if one did.
fn winding_turns_pinned(
    b: &mut Build,
    k: usize,
    n: u32,
    rest: Option<usize>,
) -> Result<(), Refusal> {
    let name = b.windings[k].name.clone();
    let old = b.windings[k].turns;
    let outermost = plain_sections(b, &name, usize::MAX).into_iter().max();
    let Some(j) = rest.or(outermost) else {
        return Err(format!(
            "every turn of \"{name}\" is in a bifilar section: set that section's turns in the stack"
        ));
    };
    let t = i64::from(turns_of(b, j)) + i64::from(n) - i64::from(old);
    if t < 1 {
        let which = match rest {
            Some(_) => format!("the section of \"{name}\" that takes the rest"),
            None => format!("the outermost section of \"{name}\""),
        };
        return Err(format!("{which} has only {} turns to give", turns_of(b, j)));
    }
    if let Some(s) = ws_mut(b, j) {
        s.turns = Some(t as u32);
    }
    b.windings[k].turns = n;
    Ok(())
}

pub fn next_role(r: Role) -> Role {
    let i = Role::ALL.iter().position(|&x| x == r).unwrap_or(0);
    Role::ALL[(i + 1) % Role::ALL.len()]
}

pub fn next_grade(g: Insulation) -> Insulation {
    let i = Insulation::ALL.iter().position(|&x| x == g).unwrap_or(0);
    Insulation::ALL[(i + 1) % Insulation::ALL.len()]
}

/// A name not yet used, preferring letters not yet used as any winding's first letter (the
/// drawing tells windings apart by that letter).
pub fn fresh_name(b: &Build) -> String {
    let firsts: Vec<char> = b
        .windings
        .iter()
        .filter_map(|w| w.name.chars().next())
        .map(|c| c.to_ascii_uppercase())
        .collect();
    for c in ['A', 'X', 'Y', 'Z', 'F', 'H', 'B', 'C', 'D', 'E'] {
        if !firsts.contains(&c) {
            return c.to_string();
        }
    }
    (2..)
        .map(|n| format!("W{n}"))
        .find(|n| b.winding(n).is_none())
        .unwrap_or_else(|| "W".into())
}

/// Add an auxiliary winding of 10 turns, wound outermost under the outer tape wraps with a
/// wrap of tape under it. Returns its index.
pub fn add_winding(b: &mut Build) -> Result<usize, Refusal> {
    let name = fresh_name(b);
    b.windings.push(Winding {
        name: name.as_str().into(),
        role: Role::Auxiliary,
        turns: 10,
        wire: WireSize::Metric { bare_mm: 0.25 },
        insulation: Insulation::Grade2,
        strands: 1,
        conductor: Default::default(),
        current_rms_a: None,
        start_pin: None,
        finish_pin: None,
    });
    wind_outermost(b, name, None);
    Ok(b.windings.len() - 1)
}

/// A section of `winding` after the outermost winding section, on one wrap of tape.
fn wind_outermost(b: &mut Build, winding: String, turns: Option<u32>) {
    let at = b
        .stack
        .iter()
        .rposition(|s| matches!(s, Section::Winding(_)))
        .map_or(0, |j| j + 1);
    b.stack.insert(at, Section::Tape { wraps: 1 });
    b.stack.insert(
        at + 1,
        Section::Winding(WindingSection {
            winding,
            turns,
            partner: None,
            layer_tape: 0,
            spread: false,
        }),
    );
}

/// Delete a winding: its own sections go, its bifilar sections stay with the partner alone.
pub fn delete_winding(b: &mut Build, k: usize) -> Result<usize, Refusal> {
    if b.windings.len() <= 1 {
        return Err("a build needs at least one winding".into());
    }
    let name = b.windings[k].name.clone();
    let mut out = Vec::new();
    for s in b.stack.drain(..) {
        match s {
            Section::Winding(mut ws) if ws.winding == name => {
                if let Some(p) = ws.partner.take() {
                    ws.winding = p;
                    out.push(Section::Winding(ws));
                }
            }
            Section::Winding(mut ws) => {
                if ws.partner.as_deref() == Some(name.as_str()) {
                    ws.partner = None;
                }
                out.push(Section::Winding(ws));
            }
            t => out.push(t),
        }
    }
    b.stack = out;
    b.windings.remove(k);
    Ok(k.min(b.windings.len() - 1))
}

/// A fresh build on a bobbin: a primary, a wrap of tape, a secondary, two outer wraps.
pub fn new_build(id: &str, bobbin: crate::model::Bobbin) -> Build {
    let w = |name: &str, role, turns, bare_mm| Winding {
        name: name.into(),
        role,
        turns,
        wire: WireSize::Metric { bare_mm },
        insulation: Insulation::Grade2,
        strands: 1,
        conductor: Default::default(),
        current_rms_a: None,
        start_pin: None,
        finish_pin: None,
    };
    let sec = |name: &str| {
        Section::Winding(WindingSection {
            winding: name.into(),
            turns: None,
            partner: None,
            layer_tape: 0,
            spread: false,
        })
    };
    Build {
        title: format!("new build on {id}"),
        bobbin_source: BobbinSource::Id(id.to_string()),
        bobbin,
        setup: Setup::default(),
        windings: vec![
            w("P", Role::Primary, 20, 0.4),
            w("S", Role::Secondary, 10, 0.5),
        ],
        stack: vec![
            sec("P"),
            Section::Tape { wraps: 1 },
            sec("S"),
            Section::Tape { wraps: 2 },
        ],
        operating: None,
        material: None,
        isolation: None,
        measured: None,
    }
}
