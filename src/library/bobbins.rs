//! The bundled bobbin library: the files of `bobbins/`, compiled into the binary by build.rs.

/// (id, file text) of every bundled bobbin, sorted by id.
pub fn bundled() -> &'static [(&'static str, &'static str)] {
    BUNDLED
}

static BUNDLED: &[(&str, &str)] = include!(concat!(env!("OUT_DIR"), "/bundled_bobbins.rs"));
