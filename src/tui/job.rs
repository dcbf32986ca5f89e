//! Long work off the screen's thread: a search or a design runs on a std thread with a shared
//! progress count and a cancel flag; the run loop polls it between keys and hands its result
//! to the App as a message (`App::job_done`). The build is only read by the work.

use crate::engine::design::{DesignOutcome, DesignSettings, design};
use crate::engine::search::{Outcome, SearchError, Settings, search_cancellable};
use crate::model::{Bobbin, Build, Requirements};
use std::sync::Arc;
use std::sync::atomic::{AtomicBool, AtomicUsize, Ordering};
use std::thread::JoinHandle;

/// What a job is doing, for the status line's words.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum JobKind {
    /// The search on the build (counts combinations tried).
    Search,
    /// The design from requirements (counts bobbins done).
    Design,
}

/// What a finished job hands back.
#[derive(Debug)]
pub enum JobResult {
    /// The search's outcome, or why it stopped.
    Search(Result<Outcome, SearchError>),
    /// The design's outcome, with the requirements it answers.
    Design {
        /// What `engine::design::design` found.
        outcome: DesignOutcome,
        /// The requirements designed for.
        req: Box<Requirements>,
    },
}

/// A job under way.
#[derive(Debug)]
pub struct Job {
    /// What it does.
    pub kind: JobKind,
    done: Arc<AtomicUsize>,
    total: Arc<AtomicUsize>,
    cancel: Arc<AtomicBool>,
    handle: Option<JoinHandle<JobResult>>,
}

impl Job {
    /// Start the search on a copy of `build`.
    pub fn search(build: Build, settings: Settings) -> Job {
        Job::spawn(JobKind::Search, move |progress, cancel| {
            JobResult::Search(search_cancellable(&build, &settings, progress, cancel))
        })
    }

    /// Start the design on `bobbins` (id, bobbin).
    pub fn design(
        req: Requirements,
        bobbins: Vec<(String, Bobbin)>,
        settings: DesignSettings,
    ) -> Job {
        let total = bobbins.len();
        let job = Job::spawn(JobKind::Design, move |progress, cancel| JobResult::Design {
            outcome: design(&req, &bobbins, &settings, progress, cancel),
            req: Box::new(req),
        });
        job.total.store(total, Ordering::Relaxed);
        job
    }

    fn spawn(
        kind: JobKind,
        work: impl FnOnce(&(dyn Fn(usize, usize) + Sync), &AtomicBool) -> JobResult + Send + 'static,
    ) -> Job {
        let done = Arc::new(AtomicUsize::new(0));
        let total = Arc::new(AtomicUsize::new(0));
        let cancel = Arc::new(AtomicBool::new(false));
        let (d, t, c) = (done.clone(), total.clone(), cancel.clone());
        let handle = std::thread::spawn(move || {
            let progress = move |n: usize, of: usize| {
                d.store(n, Ordering::Relaxed);
                t.store(of, Ordering::Relaxed);
            };
            work(&progress, &c)
        });
        Job {
            kind,
            done,
            total,
            cancel,
            handle: Some(handle),
        }
    }

    /// (done, total) as last reported; total is 0 until the work has counted it.
    pub fn progress(&self) -> (usize, usize) {
        (
            self.done.load(Ordering::Relaxed),
            self.total.load(Ordering::Relaxed),
        )
    }

    /// Ask the work to stop; it does within a few milliseconds (the search) or after the
    /// bobbin under way (the design).
    pub fn cancel(&self) {
        self.cancel.store(true, Ordering::Relaxed);
    }

    /// True once the user asked it to stop.
    pub fn cancelled(&self) -> bool {
        self.cancel.load(Ordering::Relaxed)
    }

    /// True when the work has returned and `finish` will not wait.
    pub fn is_finished(&self) -> bool {
        self.handle.as_ref().is_none_or(JoinHandle::is_finished)
    }

    /// Wait for the work and take its result; `None` when the thread panicked (a bug).
    pub fn finish(mut self) -> Option<JobResult> {
        self.handle.take()?.join().ok()
    }

    /// The status line's words while it runs: "searching: 1,240 of 8,000 tried".
    pub fn words(&self) -> String {
        let (done, total) = self.progress();
        let stop = if self.cancelled() {
            "stopping..."
        } else {
            "Esc cancels"
        };
        match (self.kind, total) {
            (JobKind::Search, 0) => format!("searching... — {stop}"),
            (JobKind::Search, _) => format!(
                "searching: {} of {} tried — {stop}",
                thousands(done),
                thousands(total)
            ),
            (JobKind::Design, _) => {
                format!("designing: {done} of {total} bobbins done — {stop}")
            }
        }
    }
}

/// A count with thousands separators: 8000 -> "8,000".
pub fn thousands(n: usize) -> String {
    let s = n.to_string();
    let mut out = String::new();
    for (i, ch) in s.chars().enumerate() {
        if i > 0 && (s.len() - i).is_multiple_of(3) {
            out.push(',');
        }
        out.push(ch);
    }
    out
}

impl crate::tui::app::App {
    /// A key while a job runs: Esc or Ctrl-C asks it to stop; any other key waits.
    pub(crate) fn job_key(&mut self, action: crate::tui::action::Action) {
        if action == crate::tui::action::Action::Cancel
            && let Some(job) = &self.job
        {
            job.cancel();
        }
    }

    /// Take the job's result when it has finished (the run loop calls this every tick);
    /// true when one was taken.
    pub fn poll_job(&mut self) -> bool {
        if !self.job.as_ref().is_some_and(Job::is_finished) {
            return false;
        }
        let Some(job) = self.job.take() else {
            return false;
        };
        let (cancelled, kind) = (job.cancelled(), job.kind);
        match job.finish() {
            Some(result) => self.job_done(result, cancelled),
            None => self.error(match kind {
                JobKind::Search => {
                    "the search stopped on an internal error; the build is as it was"
                }
                JobKind::Design => {
                    "the design stopped on an internal error; the build is as it was"
                }
            }),
        }
        true
    }

    /// A job's result, as a message: a cancelled job (the user pressed Esc, whether or not
    /// the work got to stop) leaves everything as it was and says so.
    pub fn job_done(&mut self, result: JobResult, cancelled: bool) {
        match result {
            JobResult::Search(r) => self.search_done(r, cancelled),
            JobResult::Design { outcome, req } => self.design_done(outcome, *req, cancelled),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::thousands;

    #[test]
    fn thousands_groups_by_three() {
        assert_eq!(thousands(0), "0");
        assert_eq!(thousands(999), "999");
        assert_eq!(thousands(1240), "1,240");
        assert_eq!(thousands(1_000_000), "1,000,000");
    }
}
