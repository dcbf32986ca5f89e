//! Manual check, ignored by default (CI installs no browser): print each example's HTML sheet
//! to PDF with headless Chromium (Debian's `chromium`) and check a PDF comes out. Run with
//! `cargo test --test it sheet_print -- --ignored`, then look at the PDFs it names.

use std::path::Path;
use std::process::Command;

#[test]
#[ignore = "needs Debian's chromium; a manual step, see README"]
fn html_sheets_print_to_pdf_in_headless_chromium() {
    let out = tempfile::tempdir().unwrap();
    for name in ["bench-forward", "mains-isolated", "salvaged-too-small"] {
        let file = Path::new(env!("CARGO_MANIFEST_DIR")).join(format!("examples/{name}.toml"));
        let html = out.path().join(format!("{name}.html"));
        let pdf = out.path().join(format!("{name}.pdf"));
        let status = Command::new(env!("CARGO_BIN_EXE_turnstack"))
            .arg("sheet")
            .arg(&file)
            .arg("--html")
            .arg(&html)
            .status()
            .unwrap();
        assert!(status.code() == Some(0) || status.code() == Some(1));
        let profile = tempfile::tempdir().unwrap();
        let status = Command::new("chromium")
            .args([
                "--headless",
                "--no-sandbox",
                "--disable-gpu",
                "--disable-background-networking",
                "--disable-component-update",
                "--disable-sync",
                "--no-first-run",
                "--no-pdf-header-footer",
            ])
            .arg(format!("--user-data-dir={}", profile.path().display()))
            .arg(format!("--print-to-pdf={}", pdf.display()))
            .arg(format!("file://{}", html.display()))
            .status()
            .expect("chromium is not installed");
        assert!(status.success());
        let bytes = std::fs::read(&pdf).unwrap();
        assert!(bytes.starts_with(b"%PDF"), "{name}: not a PDF");
        eprintln!("{name}: {} ({} bytes)", pdf.display(), bytes.len());
    }
    // Keep the folder so the PDFs can be looked at.
    let _ = out.keep();
}
