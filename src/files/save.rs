//! Writing bobbins as tidy, hand-editable TOML (with the number, string and bobbin forms the
//! build file's text in `build_toml.rs` shares), and replacing files atomically.

use crate::model::{Bobbin, Tube, WireSize};
use std::fmt::Write as _;
use std::io::Write as _;
use std::path::{Path, PathBuf};

/// Shortest text that reads back as the same number, always with a decimal point.
pub(super) fn num(x: f64) -> String {
    let s = format!("{x:?}");
    if s.contains(['.', 'e', 'E']) || !x.is_finite() {
        s
    } else {
        format!("{s}.0")
    }
}

/// A named wire as text that reads back as the same size: a metric diameter is written with
/// all its digits (`"0.31549mm"`, `"0.00004mm"`), never rounded.
pub fn wire_text(w: &WireSize) -> String {
    match *w {
        // `{}` of an f64 is the shortest decimal that reads back as the same number.
        WireSize::Metric { bare_mm } => format!("{bare_mm}mm"),
        other => other.key().unwrap_or_default(),
    }
}

/// A TOML string, quoted and escaped.
pub(super) fn quote(s: &str) -> String {
    toml::Value::String(s.to_string()).to_string()
}

/// Our temporary files older than this, left by a crash, are removed on the next save.
const STALE_TEMP: std::time::Duration = std::time::Duration::from_secs(3600);

/// The folder a file is written into.
fn folder_of(path: &Path) -> &Path {
    match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p,
        _ => Path::new("."),
    }
}

/// The file a save really writes: through a symbolic link to the file it points at.
pub fn resolve_target(path: &Path) -> PathBuf {
    let mut p = path.to_path_buf();
    // A chain of links, but never a loop.
    for _ in 0..40 {
        match std::fs::symlink_metadata(&p) {
            Ok(m) if m.file_type().is_symlink() => match std::fs::read_link(&p) {
                Ok(next) => p = folder_of(&p).join(next),
                Err(_) => break,
            },
            _ => break,
        }
    }
    p
}

/// Remove `.turnstack-*.tmp` files this program left in `dir` in a crash, once they are old
/// enough that no running save can own them.
fn remove_stale_temps(dir: &Path) {
    let Ok(entries) = std::fs::read_dir(dir) else {
        return;
    };
    for e in entries.flatten() {
        let name = e.file_name();
        let name = name.to_string_lossy();
        if !(name.starts_with(".turnstack-") && name.ends_with(".tmp")) {
            continue;
        }
        let old = e
            .metadata()
            .ok()
            .filter(std::fs::Metadata::is_file)
            .and_then(|m| m.modified().ok())
            .and_then(|t| t.elapsed().ok())
            .is_some_and(|age| age > STALE_TEMP);
        if old {
            let _ = std::fs::remove_file(e.path());
        }
    }
}

/// Write `text` to `path` by a temporary file in the same folder, synced, then renamed over
/// the old file, and the folder synced: a crash leaves either the old file or the new one,
/// never half of either. A symbolic link is written through (the file it points at gets the
/// text; the link stays). Errors name the user's file, never the temporary one.
pub fn write_atomic(path: &Path, text: &str) -> std::io::Result<()> {
    let target = resolve_target(path);
    let dir = folder_of(&target);
    if !dir.is_dir() {
        return Err(std::io::Error::new(
            std::io::ErrorKind::NotFound,
            format!("the folder {} does not exist", dir.display()),
        ));
    }
    remove_stale_temps(dir);
    let mut tmp = tempfile::Builder::new()
        .prefix(".turnstack-")
        .suffix(".tmp")
        .tempfile_in(dir)
        .map_err(|e| plain(e, dir))?;
    tmp.write_all(text.as_bytes()).map_err(|e| plain(e, dir))?;
    // The temporary file is private (0600); the saved file keeps the old file's permissions,
    // or gets the usual ones for a document the user may share.
    let permissions = match std::fs::metadata(&target) {
        Ok(m) => Some(m.permissions()),
        Err(_) => default_permissions(),
    };
    if let Some(p) = permissions {
        tmp.as_file()
            .set_permissions(p)
            .map_err(|e| plain(e, dir))?;
    }
    tmp.as_file().sync_all().map_err(|e| plain(e, dir))?;
    tmp.persist(&target).map_err(|e| plain(e.error, dir))?;
    sync_folder(dir);
    Ok(())
}

/// An I/O error in words that do not name the temporary file.
fn plain(e: std::io::Error, dir: &Path) -> std::io::Error {
    let why = match e.kind() {
        std::io::ErrorKind::PermissionDenied => {
            format!("no permission to write in the folder {}", dir.display())
        }
        std::io::ErrorKind::NotFound => format!("the folder {} does not exist", dir.display()),
        _ => {
            // The kind's own words; the OS message may carry the temporary path.
            let k = e.kind().to_string();
            format!("cannot write in the folder {}: {k}", dir.display())
        }
    };
    std::io::Error::new(e.kind(), why)
}

/// May a command write `out`? Never over its input (even with `--force`: the build would be
/// lost), never over a folder, and over another existing file only with `force`.
pub fn check_output(out: &Path, input: Option<&Path>, force: bool) -> Result<(), String> {
    let same = |a: &Path, b: &Path| match (std::fs::canonicalize(a), std::fs::canonicalize(b)) {
        (Ok(x), Ok(y)) => x == y,
        _ => a == b,
    };
    if let Some(i) = input
        && same(out, i)
    {
        return Err(format!(
            "{} is the input build: the output never replaces it (name another file)",
            out.display()
        ));
    }
    if out.is_dir() {
        return Err(format!("{} is a folder: name a file", out.display()));
    }
    if !force && std::fs::symlink_metadata(out).is_ok() {
        return Err(format!(
            "{} exists: not replaced (add --force to replace it)",
            out.display()
        ));
    }
    let dir = folder_of(out);
    if !dir.is_dir() {
        return Err(format!("the folder {} does not exist", dir.display()));
    }
    Ok(())
}

#[cfg(unix)]
fn sync_folder(dir: &Path) {
    // A rename is durable only once the folder's entry is on disk.
    if let Ok(f) = std::fs::File::open(dir) {
        let _ = f.sync_all();
    }
}

#[cfg(not(unix))]
fn sync_folder(_dir: &Path) {}

#[cfg(unix)]
fn default_permissions() -> Option<std::fs::Permissions> {
    use std::os::unix::fs::PermissionsExt;
    // rw-r--r--: what an editor gives a new document under the usual umask of 022.
    Some(std::fs::Permissions::from_mode(0o644))
}

#[cfg(not(unix))]
fn default_permissions() -> Option<std::fs::Permissions> {
    None
}

/// A bobbin's keys, its tables named after `prefix` (`"bobbin."` inside a build file).
pub(super) fn bobbin_keys(out: &mut String, b: &Bobbin, prefix: &str) {
    if !b.name.is_empty() {
        let _ = writeln!(out, "name = {}", quote(&b.name));
    }
    if !b.origin.is_empty() {
        let _ = writeln!(out, "origin = {}", quote(&b.origin));
    }
    let _ = writeln!(out, "\n[{prefix}window]");
    let _ = writeln!(out, "width_mm = {}", num(b.window.width_mm));
    let _ = writeln!(out, "height_mm = {}", num(b.window.height_mm));
    let _ = writeln!(out, "\n[{prefix}tube]");
    match b.tube {
        Tube::Rect {
            width_mm,
            depth_mm,
            corner_radius_mm,
        } => {
            let _ = writeln!(out, "shape = \"rect\"");
            let _ = writeln!(out, "width_mm = {}", num(width_mm));
            let _ = writeln!(out, "depth_mm = {}", num(depth_mm));
            let _ = writeln!(out, "corner_radius_mm = {}", num(corner_radius_mm));
        }
        Tube::Round { diameter_mm } => {
            let _ = writeln!(out, "shape = \"round\"");
            let _ = writeln!(out, "diameter_mm = {}", num(diameter_mm));
        }
    }
    if let Some(c) = &b.core {
        let _ = writeln!(out, "\n[{prefix}core]");
        let _ = writeln!(out, "ae_mm2 = {}", num(c.ae_mm2));
        let _ = writeln!(out, "le_mm = {}", num(c.le_mm));
        if let Some(v) = c.ve_mm3 {
            let _ = writeln!(out, "ve_mm3 = {}", num(v));
        }
        if let Some(v) = c.al_nh {
            let _ = writeln!(out, "al_nh = {}", num(v));
        }
    }
    if let Some(n) = b.pin_count {
        let _ = writeln!(out, "\n[{prefix}pins]\ncount = {n}");
    }
}

/// A bobbin file (`format = 1` and the bobbin keys).
pub fn bobbin_to_toml(b: &Bobbin) -> String {
    let mut out = String::from("format = 1\n");
    bobbin_keys(&mut out, b, "");
    out
}

#[cfg(all(test, unix))]
mod tests {
    use super::*;
    use std::os::unix::fs::PermissionsExt;

    #[test]
    fn saving_keeps_the_old_files_permissions_and_gives_new_files_the_usual_ones() {
        let dir = tempfile::tempdir().unwrap();
        let old = dir.path().join("old.toml");
        std::fs::write(&old, "x").unwrap();
        std::fs::set_permissions(&old, std::fs::Permissions::from_mode(0o640)).unwrap();
        write_atomic(&old, "new text").unwrap();
        assert_eq!(std::fs::read_to_string(&old).unwrap(), "new text");
        assert_eq!(
            std::fs::metadata(&old).unwrap().permissions().mode() & 0o777,
            0o640
        );

        let new = dir.path().join("new.toml");
        write_atomic(&new, "y").unwrap();
        assert_eq!(
            std::fs::metadata(&new).unwrap().permissions().mode() & 0o777,
            0o644
        );
        // No temporary file is left behind.
        let left: Vec<_> = std::fs::read_dir(dir.path())
            .unwrap()
            .filter_map(|e| e.ok())
            .collect();
        assert_eq!(left.len(), 2);
    }
}
