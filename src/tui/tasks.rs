//! The winding sheet's page, and what the status line says after the loop wrote a file.
//! The figures come from `report::sheet`; the loop calls these for the matching `Effect`.

use super::app::App;
use crate::report::sheet::{self, html, svg, text};
use std::path::Path;

/// Lines of a text sheet's page, as the CLI's default.
const SHEET_PAGE_LINES: usize = 60;
/// The bench temperature the sheet's resistance checks are given at, as the CLI's default.
const SHEET_MEASURE_AT_C: f64 = 20.0;

impl App {
    /// The winding sheet of the current build as the page to write to `path`: HTML for a
    /// name ending in .html, else text pages. The loop writes it.
    pub fn sheet_page(&self, path: &Path) -> SheetPage {
        let s = sheet::sheet(&self.doc.build, &self.doc.eval, SHEET_MEASURE_AT_C);
        let html = path
            .extension()
            .is_some_and(|e| e.eq_ignore_ascii_case("html"));
        let text = if html {
            let (scale, drawing) = svg::cross_section(&self.doc.build, &self.doc.eval);
            html::render(&s, &drawing, scale)
        } else {
            text::render(&s, SHEET_PAGE_LINES)
        };
        SheetPage {
            text,
            html,
            build_id: s.build_id,
        }
    }

    /// The loop wrote (or failed to write) the sheet `page` to `path`.
    pub fn wrote_sheet(&mut self, path: &Path, page: &SheetPage, result: std::io::Result<()>) {
        let shown = std::path::absolute(path).unwrap_or_else(|_| path.to_path_buf());
        match result {
            Ok(()) => {
                let kind = if page.html { "HTML" } else { "text" };
                let warn = if self.doc.eval.fits {
                    ""
                } else {
                    " (it does not fit: the sheet says DO NOT WIND)"
                };
                self.info(format!(
                    "wrote {}: the {kind} winding sheet of build {}{warn}",
                    shown.display(),
                    page.build_id
                ));
            }
            Err(e) => self.error(format!("cannot write {}: {e}", shown.display())),
        }
    }

    /// The loop wrote (or failed to write) a bobbin file to `path`.
    pub fn wrote_bobbin(&mut self, path: &Path, result: std::io::Result<()>) {
        match result {
            Ok(()) => self.info(format!("saved the bobbin to {}", path.display())),
            Err(e) => self.error(format!("cannot write {}: {e}", path.display())),
        }
    }
}

/// A winding sheet ready to write.
pub struct SheetPage {
    /// The whole file.
    pub text: String,
    /// HTML (a printable page) rather than text pages.
    pub html: bool,
    /// The build id the sheet carries.
    pub build_id: String,
}
