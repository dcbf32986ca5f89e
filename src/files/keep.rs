//! Comment-keeping saves: a build is written onto the text it was read from, so that only the
//! values an edit changed are rewritten. Every comment, the order of tables and keys and the
//! number format of every untouched value stay byte for byte.
//!
//! The method needs no record of what was edited: the build is first written as today's tidy
//! text (the "generated" document), then that document is merged onto the base text value by
//! value. A value that reads back the same (`100` and `100.0`, `"0.40mm"` and `"0.4mm"`, a key
//! left out and the default it stands for) is left as the user wrote it; a changed value takes
//! the new number in the old value's place, keeping its trailing comment; a new table goes
//! after its neighbour in the usual order; a removed winding or section goes with the comments
//! above it. Windings are matched by name, stack sections by content (a longest common
//! subsequence), so an insertion or deletion in the middle leaves the others alone.

use super::build_toml::build_to_toml;
use crate::model::WireSize;
use toml_edit::{ArrayOfTables, DocumentMut, InlineTable, Item, Table, Value};

/// Spacing between the positions of the base text's tables, leaving room for new ones.
const GAP: isize = 1 << 20;

/// The build written onto `base`, or `None` when `base` is not TOML.
pub fn merge_onto(base: &str, build: &crate::model::Build) -> Option<String> {
    let mut doc: DocumentMut = base.parse().ok()?;
    let mut generated: DocumentMut = build_to_toml(build).parse().ok()?;
    keep_shorthand_beside_outputs(&doc, &mut generated);
    spread_positions(doc.as_table_mut());
    merge_table(doc.as_table_mut(), generated.as_table(), "");
    place_new_tables(doc.as_table_mut(), generated.as_table());
    Some(doc.to_string())
}

/// A file that gives `[operating] vout_v` / `iout_a` beside `[[output]]` tables (allowed when
/// they say what the first output says) keeps them, with the first output's values.
fn keep_shorthand_beside_outputs(base: &DocumentMut, generated: &mut DocumentMut) {
    let first = generated
        .get("output")
        .and_then(Item::as_array_of_tables)
        .and_then(|a| a.get(0))
        .cloned();
    let (Some(first), Some(base_op)) = (first, base.get("operating").and_then(Item::as_table))
    else {
        return;
    };
    let Some(op) = generated.get_mut("operating").and_then(Item::as_table_mut) else {
        return;
    };
    for key in ["vout_v", "iout_a"] {
        if base_op.contains_key(key)
            && let Some(v) = first.get(key)
        {
            op.insert(key, v.clone());
        }
    }
}

fn spread_positions(t: &mut Table) {
    if let Some(p) = t.position() {
        t.set_position(Some(p.saturating_mul(GAP)));
    }
    for (_, item) in t.iter_mut() {
        match item {
            Item::Table(sub) => spread_positions(sub),
            Item::ArrayOfTables(a) => a.iter_mut().for_each(spread_positions),
            _ => {}
        }
    }
}

fn clear_positions(t: &mut Table) {
    t.set_position(None);
    for (_, item) in t.iter_mut() {
        match item {
            Item::Table(sub) => clear_positions(sub),
            Item::ArrayOfTables(a) => a.iter_mut().for_each(clear_positions),
            _ => {}
        }
    }
}

/// Give every new table (no position yet) the place just after the table before it, walking
/// the top-level keys in the generated order (bobbin, setup, winding, stack, operating, ...).
fn place_new_tables(root: &mut Table, generated: &Table) {
    let order: Vec<String> = generated
        .iter()
        .map(|(k, _)| k.to_string())
        .chain(root.iter().map(|(k, _)| k.to_string()))
        .collect();
    let mut seen = std::collections::HashSet::new();
    let mut prev = 0isize;
    for key in order {
        if !seen.insert(key.clone()) {
            continue;
        }
        match root.get_mut(&key) {
            Some(Item::Table(t)) => place(t, &mut prev),
            Some(Item::ArrayOfTables(a)) => {
                // The entries of one array keep the planner's order: one moved past another
                // goes after it.
                let mut floor: Option<isize> = None;
                for t in a.iter_mut() {
                    if let (Some(p), Some(f)) = (t.position(), floor)
                        && p <= f
                    {
                        t.set_position(None);
                    }
                    place(t, &mut prev);
                    floor = Some(prev);
                }
            }
            _ => {}
        }
    }
}

fn place(t: &mut Table, prev: &mut isize) {
    match t.position() {
        Some(p) => *prev = p,
        None => {
            *prev += 1;
            t.set_position(Some(*prev));
        }
    }
    for (_, item) in t.iter_mut() {
        match item {
            Item::Table(sub) => place(sub, prev),
            Item::ArrayOfTables(a) => a.iter_mut().for_each(|s| place(s, prev)),
            _ => {}
        }
    }
}

fn child(path: &str, key: &str) -> String {
    if path.is_empty() {
        key.to_string()
    } else {
        format!("{path}.{key}")
    }
}

/// A value the loader takes when the key is left out.
enum Default {
    Num(f64),
    Str(&'static str),
    Bool(bool),
}

/// The default of `key` in the table at `path`; `generated` is that table as generated (the
/// material's bundled ferrite decides its defaults).
fn default_of(path: &str, key: &str, generated: &Table) -> Option<Default> {
    use Default::{Bool, Num, Str};
    let d = crate::model::Setup::default();
    Some(match (path, key) {
        ("", "title") => Str(""),
        ("setup", "bulge") => Num(d.allowance_factor),
        ("setup", "margin_mm") => Num(d.margin_mm),
        ("setup", "tape_mm") => Num(d.tape_mm),
        ("winding", "insulation") => Str("grade2"),
        ("winding", "strands") => Num(1.0),
        // A tape section takes neither key: no default to write in one's place.
        ("stack", "layer_tape" | "spread") if generated.contains_key("tape") => return None,
        ("stack", "layer_tape") => Num(0.0),
        ("stack", "spread") => Bool(false),
        ("operating", "converter") => Str("forward"),
        ("operating", "reset_side") => Str("primary"),
        ("operating", "rectifier_drop_v" | "switch_drop_v") => Num(0.0),
        ("bobbin", "name" | "origin") => Str(""),
        ("material", k) => {
            let ferrite = generated
                .get("grade")
                .and_then(Item::as_str)
                .and_then(crate::library::materials::find)?;
            match k {
                "bsat_mt" => Num(ferrite.bsat_mt),
                "br_mt" => Num(ferrite.br_mt),
                "mu_i" => Num(ferrite.mu_i),
                _ => return None,
            }
        }
        _ => return None,
    })
}

/// A default as the value a file would state it with.
fn default_value(d: Default) -> Value {
    match d {
        Default::Num(x) if x.fract() == 0.0 && x.abs() < 9.0e15 => Value::from(x as i64),
        Default::Num(x) => Value::from(x),
        Default::Str(s) => Value::from(s),
        Default::Bool(b) => Value::from(b),
    }
}

fn is_default(item: &Item, d: Option<Default>) -> bool {
    let Some(v) = item.as_value() else {
        return false;
    };
    match d {
        Some(Default::Num(x)) => number(v) == Some(x),
        Some(Default::Str(s)) => v.as_str() == Some(s),
        Some(Default::Bool(b)) => v.as_bool() == Some(b),
        None => false,
    }
}

fn number(v: &Value) -> Option<f64> {
    match v {
        Value::Integer(i) => Some(*i.value() as f64),
        Value::Float(f) => Some(*f.value()),
        _ => None,
    }
}

/// The two values read back as the same thing.
fn same_value(b: &Value, g: &Value, key: &str) -> bool {
    match (b, g) {
        (Value::Integer(x), Value::Integer(y)) => x.value() == y.value(),
        (Value::String(x), Value::String(y)) => {
            x.value() == y.value()
                || (key == "wire"
                    && WireSize::parse(x.value()).is_some()
                    && WireSize::parse(x.value()) == WireSize::parse(y.value()))
        }
        // A pin label written as a bare number.
        (Value::Integer(x), Value::String(y)) => x.value().to_string() == *y.value(),
        (Value::InlineTable(x), Value::InlineTable(y)) => {
            x.len() == y.len()
                && y.iter()
                    .all(|(k, gv)| x.get(k).is_some_and(|bv| same_value(bv, gv, k)))
        }
        _ => match (number(b), number(g)) {
            (Some(x), Some(y)) => x == y,
            _ => b.to_string().trim() == g.to_string().trim(),
        },
    }
}

/// Put `g` in place of `b`, keeping `b`'s spacing and trailing comment; an integral number
/// written as a whole number stays one.
fn replace_value(b: &mut Value, g: &Value) {
    let decor = b.decor().clone();
    let mut new = match (&*b, g) {
        (Value::Integer(_), Value::Float(f))
            if f.value().fract() == 0.0 && f.value().abs() < 9.0e15 =>
        {
            Value::from(*f.value() as i64)
        }
        _ => g.clone(),
    };
    *new.decor_mut() = decor;
    *b = new;
}

fn merge_value(b: &mut Value, g: &Value, key: &str) {
    if same_value(b, g, key) {
        return;
    }
    if let (Value::InlineTable(bt), Value::InlineTable(gt)) = (&mut *b, g) {
        merge_inline(bt, gt);
        return;
    }
    replace_value(b, g);
}

fn merge_inline(b: &mut InlineTable, g: &InlineTable) {
    let gone: Vec<String> = b
        .iter()
        .filter(|(k, _)| !g.contains_key(k))
        .map(|(k, _)| k.to_string())
        .collect();
    for k in gone {
        b.remove(&k);
    }
    for (k, gv) in g.iter() {
        match b.get_mut(k) {
            Some(bv) => merge_value(bv, gv, k),
            None => {
                b.insert(k, gv.clone());
            }
        }
    }
}

fn merge_table(b: &mut Table, g: &Table, path: &str) {
    // Keys the generated text leaves out: a key the loader has a default for takes that
    // default in place (its comment stays: the edit changed a value, not the file's shape);
    // any other goes.
    let gone: Vec<String> = b
        .iter()
        .filter(|(k, item)| !g.contains_key(k) && !is_default(item, default_of(path, k, g)))
        .map(|(k, _)| k.to_string())
        .collect();
    for k in gone {
        let to_default = default_of(path, &k, g).map(default_value);
        match (b.get_mut(&k).and_then(Item::as_value_mut), to_default) {
            (Some(bv), Some(dv)) => replace_value(bv, &dv),
            _ => {
                b.remove(&k);
            }
        }
    }
    for (k, gi) in g.iter() {
        let here = child(path, k);
        let shape = |i: &Item| (i.is_value(), i.is_table(), i.is_array_of_tables());
        if b.get(k).is_some_and(|bi| shape(bi) != shape(gi))
            && let Some(mut key) = b.key_mut(k)
        {
            // A table header's key spacing does not suit `key = value`, nor the other way.
            key.leaf_decor_mut().clear();
        }
        match b.get_mut(k) {
            Some(bi) => merge_item(bi, gi, &here, k),
            None => {
                if let Item::Table(gt) = gi {
                    let mut fresh = gt.clone();
                    fresh.clear();
                    merge_table(&mut fresh, gt, &here);
                    if !fresh.is_empty() {
                        fresh.set_position(None);
                        b.insert(k, Item::Table(fresh));
                    }
                } else if !is_default(gi, default_of(path, k, g)) {
                    let mut fresh = gi.clone();
                    match &mut fresh {
                        Item::ArrayOfTables(a) => a.iter_mut().for_each(clear_positions),
                        Item::Table(t) => clear_positions(t),
                        _ => {}
                    }
                    b.insert(k, fresh);
                }
            }
        }
    }
}

fn merge_item(b: &mut Item, g: &Item, path: &str, key: &str) {
    match (&mut *b, g) {
        (Item::Value(bv), Item::Value(gv)) => merge_value(bv, gv, key),
        (Item::Table(bt), Item::Table(gt)) => merge_table(bt, gt, path),
        (Item::ArrayOfTables(ba), Item::ArrayOfTables(ga)) => merge_array(ba, ga, path),
        _ => {
            let mut fresh = g.clone();
            match &mut fresh {
                Item::Table(t) => clear_positions(t),
                Item::ArrayOfTables(a) => a.iter_mut().for_each(clear_positions),
                _ => {}
            }
            *b = fresh;
        }
    }
}

/// The base table says what the generated one says (a left-out key counting as its default).
fn same_table(b: &Table, g: &Table, path: &str) -> bool {
    g.iter().all(|(k, gi)| match (b.get(k), gi.as_value()) {
        (Some(bi), Some(gv)) => bi.as_value().is_some_and(|bv| same_value(bv, gv, k)),
        (None, _) => is_default(gi, default_of(path, k, g)),
        _ => false,
    }) && b
        .iter()
        .all(|(k, bi)| g.contains_key(k) || is_default(bi, default_of(path, k, g)))
}

/// Windings pair by name, sections by content; what is left between two pairs is paired in
/// order (an edited entry), the rest is new or removed.
fn merge_array(b: &mut ArrayOfTables, g: &ArrayOfTables, path: &str) {
    let old: Vec<Table> = b.iter().cloned().collect();
    let new: Vec<&Table> = g.iter().collect();
    let (m, n) = (old.len(), new.len());
    let pairs = pair_entries(&old, &new, path);
    let mut out = ArrayOfTables::new();
    for (jn, gt) in new.iter().enumerate() {
        match pairs[jn] {
            Some(io) => {
                let mut t = old[io].clone();
                merge_table(&mut t, gt, path);
                out.push(t);
            }
            None => {
                let mut t = (*gt).clone();
                clear_positions(&mut t);
                out.push(t);
            }
        }
    }
    // The comment above the first entry is most often about the whole list ("the stack from
    // the tube outward"): it stays at the top when another entry becomes the first.
    if m > 0 && n > 0 && pairs[0] != Some(0) {
        let header = old[0].decor().prefix().cloned();
        let was_first = out.get(0).and_then(|t| t.decor().prefix().cloned());
        if let Some(k) = pairs.iter().position(|p| *p == Some(0))
            && let Some(t) = out.get_mut(k)
        {
            set_prefix(t, was_first);
        }
        if let Some(t) = out.get_mut(0) {
            set_prefix(t, header);
        }
    }
    *b = out;
}

/// For each generated entry, the base entry whose text it keeps (`None`: a new entry):
/// the common ones in order, then moved ones, then edited ones left in a run, then any left.
fn pair_entries(old: &[Table], new: &[&Table], path: &str) -> Vec<Option<usize>> {
    let same = |o: &Table, n: &Table| -> bool {
        if path == "winding" || path == "output" {
            o.get("name").and_then(Item::as_str).is_some()
                && o.get("name").and_then(Item::as_str) == n.get("name").and_then(Item::as_str)
        } else {
            same_table(o, n, path)
        }
    };
    let (m, n) = (old.len(), new.len());
    let (mut pairs, gaps) = common_runs(old, new, &same);
    let mut used = vec![false; m];
    pairs.iter().flatten().for_each(|&o| used[o] = true);
    pair_moved(old, new, &gaps, &mut pairs, &mut used, &same);
    // What is left in a run is the same entry edited, in order.
    for (olds, news) in &gaps {
        let olds = olds.iter().filter(|&&o| !used[o]);
        let news = news.iter().filter(|&&jn| pairs[jn].is_none());
        for (&o, &jn) in olds.zip(news).collect::<Vec<_>>() {
            used[o] = true;
            pairs[jn] = Some(o);
        }
    }
    // Then any left over, in order (an entry both moved and edited).
    let olds: Vec<usize> = (0..m).filter(|&o| !used[o]).collect();
    let news: Vec<usize> = (0..n).filter(|&jn| pairs[jn].is_none()).collect();
    for (&o, &jn) in olds.iter().zip(news.iter()) {
        pairs[jn] = Some(o);
    }
    pairs
}

/// The entries `same` pairs along the longest common subsequence, and the runs of entries
/// between two common ones: (old indices, new indices).
#[allow(clippy::type_complexity)]
fn common_runs(
    old: &[Table],
    new: &[&Table],
    same: &dyn Fn(&Table, &Table) -> bool,
) -> (Vec<Option<usize>>, Vec<(Vec<usize>, Vec<usize>)>) {
    // Longest common subsequence of equal entries.
    let (m, n) = (old.len(), new.len());
    let mut lcs = vec![vec![0usize; n + 1]; m + 1];
    for i in (0..m).rev() {
        for j in (0..n).rev() {
            lcs[i][j] = if same(&old[i], new[j]) {
                lcs[i + 1][j + 1] + 1
            } else {
                lcs[i + 1][j].max(lcs[i][j + 1])
            };
        }
    }
    let mut pairs: Vec<Option<usize>> = vec![None; n];
    // The runs of entries between two common ones: (old indices, new indices).
    let mut gaps: Vec<(Vec<usize>, Vec<usize>)> = vec![(Vec::new(), Vec::new())];
    let (mut i, mut j) = (0, 0);
    while i < m || j < n {
        if i < m && j < n && same(&old[i], new[j]) && lcs[i][j] == lcs[i + 1][j + 1] + 1 {
            pairs[j] = Some(i);
            gaps.push((Vec::new(), Vec::new()));
            i += 1;
            j += 1;
        } else if j < n && (i == m || lcs[i][j + 1] >= lcs[i + 1][j]) {
            gaps.last_mut().unwrap().1.push(j);
            j += 1;
        } else {
            gaps.last_mut().unwrap().0.push(i);
            i += 1;
        }
    }
    (pairs, gaps)
}

/// Pairs a new entry left over with an old one moved elsewhere.
fn pair_moved(
    old: &[Table],
    new: &[&Table],
    gaps: &[(Vec<usize>, Vec<usize>)],
    pairs: &mut [Option<usize>],
    used: &mut [bool],
    same: &dyn Fn(&Table, &Table) -> bool,
) {
    // An entry moved elsewhere keeps its text (and the comments above it): first one that
    // says the same, then one of the same kind (the same winding and partner, or tape).
    let kin = |o: &Table, n: &Table| -> bool {
        let s = |t: &Table, k: &str| t.get(k).and_then(Item::as_str).map(str::to_string);
        s(o, "winding") == s(n, "winding")
            && s(o, "with") == s(n, "with")
            && o.contains_key("tape") == n.contains_key("tape")
    };
    // Each looked for in the same run first, then anywhere.
    for alike in [same, &kin as &dyn Fn(&Table, &Table) -> bool] {
        for (local, gi) in [true, false]
            .into_iter()
            .flat_map(|l| (0..gaps.len()).map(move |g| (l, g)))
        {
            for &jn in &gaps[gi].1 {
                if pairs[jn].is_some() {
                    continue;
                }
                let moved = gaps
                    .iter()
                    .enumerate()
                    .filter(|(gk, _)| !local || *gk == gi)
                    .flat_map(|(_, (olds, _))| olds.iter().copied())
                    .find(|&o| !used[o] && alike(&old[o], new[jn]));
                if let Some(o) = moved {
                    used[o] = true;
                    pairs[jn] = Some(o);
                }
            }
        }
    }
}

fn set_prefix(t: &mut Table, prefix: Option<toml_edit::RawString>) {
    match prefix {
        Some(p) => t.decor_mut().set_prefix(p),
        None => t.decor_mut().set_prefix("\n"),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn an_unchanged_value_keeps_its_text_and_a_changed_one_its_comment() {
        let mut doc: DocumentMut = "t = 100   # hot\nwire = \"0.40mm\"\n".parse().unwrap();
        let g: DocumentMut = "t = 100.0\nwire = \"0.4mm\"\n".parse().unwrap();
        merge_table(doc.as_table_mut(), g.as_table(), "x");
        assert_eq!(doc.to_string(), "t = 100   # hot\nwire = \"0.40mm\"\n");
        let g: DocumentMut = "t = 120.0\nwire = \"0.5mm\"\n".parse().unwrap();
        merge_table(doc.as_table_mut(), g.as_table(), "x");
        assert_eq!(doc.to_string(), "t = 120   # hot\nwire = \"0.5mm\"\n");
    }
}
