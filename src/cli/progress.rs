//! Progress of long work on the terminal, and Ctrl-C as a stop flag. The bar is drawn on
//! stderr only when stderr is a terminal, and only after the work has run a moment, so short
//! runs and scripts see nothing.

use std::io::IsTerminal;
use std::sync::atomic::AtomicBool;
use std::sync::{Arc, Mutex};
use std::time::{Duration, Instant};

/// Quiet time before the bar first shows, and least time between two draws.
const FIRST_DRAW: Duration = Duration::from_millis(300);
const REDRAW: Duration = Duration::from_millis(100);
/// Width of the bar in characters.
const BAR_W: usize = 24;

/// A progress bar on stderr: `label [#######.........]  31 %  3100 of 10000 (Ctrl-C stops)`.
pub struct Progress {
    label: String,
    shown: bool,
    started: Instant,
    last: Mutex<Option<Instant>>,
}

impl Progress {
    /// A bar for `label`, drawn only when stderr is a terminal.
    pub fn new(label: &str) -> Self {
        Progress {
            label: label.to_string(),
            shown: std::io::stderr().is_terminal(),
            started: Instant::now(),
            last: Mutex::new(None),
        }
    }

    /// The work has done `done` of `total`; callable from any thread.
    pub fn update(&self, done: usize, total: usize) {
        if !self.shown || self.started.elapsed() < FIRST_DRAW {
            return;
        }
        let Ok(mut last) = self.last.lock() else {
            return;
        };
        if last.is_some_and(|t| t.elapsed() < REDRAW) && done < total {
            return;
        }
        *last = Some(Instant::now());
        eprint!("\r{}", bar_line(&self.label, done, total));
    }

    /// Clear the bar's line, if it was drawn.
    pub fn finish(&self) {
        if self.shown && self.last.lock().is_ok_and(|l| l.is_some()) {
            eprint!("\r{}\r", " ".repeat(self.label.len() + BAR_W + 50));
        }
    }
}

/// The bar's text for `done` of `total`.
pub fn bar_line(label: &str, done: usize, total: usize) -> String {
    let share = if total == 0 {
        1.0
    } else {
        (done as f64 / total as f64).clamp(0.0, 1.0)
    };
    let full = (share * BAR_W as f64).round() as usize;
    format!(
        "{label} [{}{}] {:>3.0} %  {done} of {total} (Ctrl-C stops)",
        "#".repeat(full),
        ".".repeat(BAR_W - full),
        share * 100.0
    )
}

/// A flag Ctrl-C sets; a second Ctrl-C ends the program at once. `None` when the handler
/// cannot be installed (then Ctrl-C ends the program as usual).
pub fn ctrl_c_flag() -> Option<Arc<AtomicBool>> {
    let flag = Arc::new(AtomicBool::new(false));
    let sig = signal_hook::consts::SIGINT;
    signal_hook::flag::register_conditional_default(sig, Arc::clone(&flag)).ok()?;
    signal_hook::flag::register(sig, Arc::clone(&flag)).ok()?;
    Some(flag)
}

#[cfg(test)]
mod tests {
    /// A quarter done fills 6 of the 24 cells and says 25 %.
    #[test]
    fn a_quarter_done_fills_a_quarter_of_the_bar() {
        let l = super::bar_line("searching", 250, 1000);
        assert!(
            l.starts_with("searching [######..................]  25 %"),
            "{l}"
        );
        assert!(l.contains("250 of 1000"), "{l}");
    }
}
