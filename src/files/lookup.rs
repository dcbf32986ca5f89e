//! Where bobbin ids are found: `bobbins/` beside the build file, the user's own folder,
//! any folder named on the command line, then the library compiled into the binary.

use super::{LoadError, parse_bobbin};
use crate::library::bobbins;
use crate::model::Bobbin;
use std::path::{Path, PathBuf};

/// Environment variable that overrides the user's bobbin folder.
pub const USER_BOBBINS_ENV: &str = "TURNSTACK_BOBBINS";

/// The user's own bobbin folder: `$TURNSTACK_BOBBINS`, else the platform's data directory
/// (`$XDG_DATA_HOME`, usually `~/.local/share`, on Linux) under `turnstack/bobbins`.
pub fn user_bobbin_dir() -> Option<PathBuf> {
    match std::env::var_os(USER_BOBBINS_ENV) {
        Some(p) if !p.is_empty() => Some(PathBuf::from(p)),
        _ => dirs::data_dir().map(|d| d.join("turnstack").join("bobbins")),
    }
}

/// Where a bobbin file of the library was found (in lookup order).
#[derive(Debug, Clone, PartialEq)]
pub enum BobbinOrigin {
    /// In the `bobbins/` folder beside the build file (that folder).
    BesideBuild(PathBuf),
    /// In the user's bobbin folder (that folder).
    User(PathBuf),
    /// In a folder added with `BobbinLibrary::with_folder` (that folder).
    Folder(PathBuf),
    /// In the set compiled into the program.
    Bundled,
}

impl BobbinOrigin {
    /// The few words lists show for the origin ("beside the build", "bundled", ...).
    pub fn label(&self) -> &'static str {
        match self {
            BobbinOrigin::BesideBuild(_) => "beside the build",
            BobbinOrigin::User(_) => "yours",
            BobbinOrigin::Folder(_) => "folder",
            BobbinOrigin::Bundled => "bundled",
        }
    }
}

/// One bobbin of the library: its id, where it was found and the bobbin, or why its file
/// cannot be read.
#[derive(Debug, Clone)]
pub struct BobbinEntry {
    /// The id a build names it by (the file name without `.toml`).
    pub id: String,
    /// Where it was found.
    pub origin: BobbinOrigin,
    /// The bobbin, or the error of its file.
    pub bobbin: Result<Bobbin, LoadError>,
}

/// How a folder's entries are labelled.
type Labeller = fn(PathBuf) -> BobbinOrigin;

/// The folders bobbins are looked up in, in order, and whether the bundled set follows.
#[derive(Debug, Clone, Default)]
pub struct BobbinLibrary {
    folders: Vec<(PathBuf, Labeller)>,
    bundled: bool,
}

impl BobbinLibrary {
    /// The user's folder and the bundled library.
    pub fn standard() -> Self {
        let mut lib = BobbinLibrary {
            folders: Vec::new(),
            bundled: true,
        };
        if let Some(d) = user_bobbin_dir() {
            lib.folders.push((d, BobbinOrigin::User));
        }
        lib
    }

    /// Lookup order for a build file: beside it, the user's folder, bundled.
    pub fn for_build(build_path: &Path) -> Self {
        let mut lib = Self::standard();
        let dir = build_path.parent().unwrap_or(Path::new("")).join("bobbins");
        lib.folders.insert(0, (dir, BobbinOrigin::BesideBuild));
        lib
    }

    /// Only the bundled library (tests, and builds with no file).
    pub fn bundled_only() -> Self {
        BobbinLibrary {
            folders: Vec::new(),
            bundled: true,
        }
    }

    /// Add a folder, searched after the ones already there and before the bundled library.
    pub fn with_folder(mut self, dir: PathBuf) -> Self {
        self.folders.push((dir, BobbinOrigin::Folder));
        self
    }

    /// The bobbin of an id, or `None` when no folder has it.
    pub fn find(&self, id: &str) -> Option<Result<Bobbin, LoadError>> {
        for (dir, _) in &self.folders {
            let path = dir.join(format!("{id}.toml"));
            if path.is_file() {
                return Some(
                    std::fs::read_to_string(&path)
                        .map_err(|e| LoadError::io(&path, &e))
                        .and_then(|t| parse_bobbin(&t, Some(&path))),
                );
            }
        }
        if self.bundled
            && let Some((_, text)) = bobbins::bundled().iter().find(|(i, _)| *i == id)
        {
            let path = PathBuf::from(format!("bobbins/{id}.toml"));
            return Some(parse_bobbin(text, Some(&path)));
        }
        None
    }

    /// Every bobbin the library can see, first occurrence of an id winning, sorted by id.
    pub fn entries(&self) -> Vec<BobbinEntry> {
        let mut out: Vec<BobbinEntry> = Vec::new();
        for (dir, origin) in &self.folders {
            let Ok(read) = std::fs::read_dir(dir) else {
                continue;
            };
            let mut paths: Vec<PathBuf> = read
                .filter_map(|e| e.ok().map(|e| e.path()))
                .filter(|p| p.extension().is_some_and(|x| x == "toml"))
                .collect();
            paths.sort();
            for path in paths {
                let Some(id) = path
                    .file_stem()
                    .and_then(|s| s.to_str())
                    .map(str::to_string)
                else {
                    continue;
                };
                if out.iter().any(|e| e.id == id) {
                    continue;
                }
                let bobbin = std::fs::read_to_string(&path)
                    .map_err(|e| LoadError::io(&path, &e))
                    .and_then(|t| parse_bobbin(&t, Some(&path)));
                out.push(BobbinEntry {
                    id,
                    origin: origin(dir.clone()),
                    bobbin,
                });
            }
        }
        if self.bundled {
            for (id, text) in bobbins::bundled() {
                if out.iter().any(|e| e.id == *id) {
                    continue;
                }
                let path = PathBuf::from(format!("bobbins/{id}.toml"));
                out.push(BobbinEntry {
                    id: (*id).to_string(),
                    origin: BobbinOrigin::Bundled,
                    bobbin: parse_bobbin(text, Some(&path)),
                });
            }
        }
        out.sort_by(|a, b| a.id.cmp(&b.id));
        out
    }

    /// The ids that exist, for a message about an unknown one.
    pub fn ids(&self) -> Vec<String> {
        self.entries().into_iter().map(|e| e.id).collect()
    }
}
