//! A build identifier printed on every sheet, so that a sheet can be matched to its file: a
//! hash of the build's canonical TOML and its bobbin's, so it ignores comments and layout of
//! the file but changes when any figure of the build or its bobbin changes.

use super::{bobbin_to_toml, build_to_toml};
use crate::model::Build;

/// FNV-1a 64-bit offset basis and prime (Fowler, Noll, Vo; IETF draft-eastlake-fnv).
const FNV_OFFSET: u64 = 0xcbf2_9ce4_8422_2325;
const FNV_PRIME: u64 = 0x0000_0100_0000_01b3;

/// FNV-1a over bytes: stable across platforms and compiler versions (unlike std's hasher).
pub fn fnv1a64(bytes: &[u8]) -> u64 {
    bytes.iter().fold(FNV_OFFSET, |h, &b| {
        (h ^ u64::from(b)).wrapping_mul(FNV_PRIME)
    })
}

/// The identifier: 16 hex digits in four groups, e.g. `3f2a-91bc-0d44-7e10`.
/// The `[measured]` table is left out: readings of a part do not change its plan.
pub fn build_id(build: &Build) -> String {
    let plan;
    let build = if build.measured.is_some() {
        let mut b = build.clone();
        b.measured = None;
        plan = b;
        &plan
    } else {
        build
    };
    let mut text = build_to_toml(build);
    text.push_str("\n# bobbin\n");
    text.push_str(&bobbin_to_toml(&build.bobbin));
    let h = fnv1a64(text.as_bytes());
    format!(
        "{:04x}-{:04x}-{:04x}-{:04x}",
        h >> 48,
        (h >> 32) & 0xffff,
        (h >> 16) & 0xffff,
        h & 0xffff
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    /// FNV-1a 64 test vectors from the FNV reference (draft-eastlake-fnv): "" and "a".
    #[test]
    fn fnv1a64_matches_reference_vectors() {
        assert_eq!(fnv1a64(b""), 0xcbf2_9ce4_8422_2325);
        assert_eq!(fnv1a64(b"a"), 0xaf63_dc4c_8601_ec8c);
    }
}
