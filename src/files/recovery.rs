//! Recovery copies: the planner writes the edited build here after each edit, so a crash or a
//! closed terminal loses nothing; the next `edit` of the same file offers it back. A copy is
//! removed when the build is saved, when the edits are undone back to the file, and when the
//! user discards it.

use super::write_atomic;
use std::path::{Path, PathBuf};

/// Environment variable that overrides the recovery folder (tests point it elsewhere).
pub const RECOVERY_ENV: &str = "TURNSTACK_RECOVERY";

/// The recovery folder: `$TURNSTACK_RECOVERY`, else the platform's state folder (on Linux
/// `$XDG_STATE_HOME`, usually `~/.local/state`), else its cache folder, under
/// `turnstack/recovery`.
pub fn recovery_dir() -> Option<PathBuf> {
    match std::env::var_os(RECOVERY_ENV) {
        Some(p) if !p.is_empty() => Some(PathBuf::from(p)),
        _ => dirs::state_dir()
            .or_else(dirs::cache_dir)
            .map(|d| d.join("turnstack").join("recovery")),
    }
}

/// FNV-1a, 64 bits: a stable name for a path (not for security).
fn fnv(bytes: &[u8]) -> u64 {
    bytes.iter().fold(0xcbf2_9ce4_8422_2325, |h, b| {
        (h ^ u64::from(*b)).wrapping_mul(0x0000_0100_0000_01b3)
    })
}

/// The recovery copy of the build at `build_path`: named after the file and a hash of its
/// absolute path, so two `b.toml` in different folders do not share one.
/// `dir` is the recovery folder, [`recovery_dir`] outside tests.
pub fn recovery_path(dir: &Path, build_path: &Path) -> Option<PathBuf> {
    let abs = std::fs::canonicalize(build_path)
        .or_else(|_| std::path::absolute(build_path))
        .ok()?;
    let stem = abs
        .file_stem()
        .map(|s| s.to_string_lossy().into_owned())
        .unwrap_or_default();
    let stem: String = stem
        .chars()
        .map(|c| {
            if c.is_alphanumeric() || "-_.".contains(c) {
                c
            } else {
                '_'
            }
        })
        .take(40)
        .collect();
    let hash = fnv(abs.as_os_str().as_encoded_bytes());
    Some(dir.join(format!("{stem}-{hash:016x}.toml")))
}

/// Keep `text` (the edited build as it would be saved) as the recovery copy of `build_path`.
pub fn write_recovery(dir: &Path, build_path: &Path, text: &str) -> std::io::Result<()> {
    let Some(p) = recovery_path(dir, build_path) else {
        return Ok(());
    };
    std::fs::create_dir_all(dir)?;
    write_atomic(&p, text)
}

/// The recovery copy of `build_path`, when there is one that says something else than the
/// file itself.
pub fn read_recovery(dir: &Path, build_path: &Path) -> Option<String> {
    let text = std::fs::read_to_string(recovery_path(dir, build_path)?).ok()?;
    let current = std::fs::read_to_string(build_path).ok();
    (current.as_deref() != Some(text.as_str())).then_some(text)
}

/// Remove the recovery copy of `build_path` (none is fine).
pub fn discard_recovery(dir: &Path, build_path: &Path) {
    if let Some(p) = recovery_path(dir, build_path) {
        let _ = std::fs::remove_file(p);
    }
}
