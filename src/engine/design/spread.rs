//! The bobbins shared out over threads: each thread takes the next bobbin not yet started,
//! the answers come back in the bobbins' own order, so the ranking is the same whatever the
//! number of threads. Pure: no I/O.

use std::sync::Mutex;
use std::sync::atomic::{AtomicBool, AtomicUsize, Ordering};

/// Run `work` on every item of `items` on up to `threads` threads (1 or more). The answer is
/// in the items' order; `None` where the item was not finished because `cancel` was set
/// (before it started, or `work` itself stopped and gave `None`). `progress(done, total)` is
/// called after each finished item, one call at a time and with `done` rising.
pub fn over<I, T, F>(
    items: &[I],
    threads: usize,
    progress: &(dyn Fn(usize, usize) + Sync),
    cancel: &AtomicBool,
    work: F,
) -> Vec<Option<T>>
where
    I: Sync,
    T: Send,
    F: Fn(&I) -> Option<T> + Sync,
{
    let total = items.len();
    let next = AtomicUsize::new(0);
    // Held while `progress` runs, so its calls never cross and `done` never goes back.
    let done = Mutex::new(0usize);
    let run = || {
        let mut mine = Vec::new();
        loop {
            if cancel.load(Ordering::Relaxed) {
                break;
            }
            let k = next.fetch_add(1, Ordering::Relaxed);
            let Some(item) = items.get(k) else {
                break;
            };
            let answer = work(item);
            let finished = answer.is_some();
            mine.push((k, answer));
            if finished && let Ok(mut n) = done.lock() {
                *n += 1;
                progress(*n, total);
            }
        }
        mine
    };
    let threads = threads.clamp(1, total.max(1));
    let parts: Vec<Vec<(usize, Option<T>)>> = if threads == 1 {
        vec![run()]
    } else {
        std::thread::scope(|s| {
            let handles: Vec<_> = (0..threads).map(|_| s.spawn(run)).collect();
            handles
                .into_iter()
                .map(|h| h.join().expect("design thread panicked"))
                .collect()
        })
    };
    let mut out: Vec<Option<T>> = (0..total).map(|_| None).collect();
    for (k, answer) in parts.into_iter().flatten() {
        out[k] = answer;
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Two threads give the answers in the items' order, as one thread does.
    #[test]
    fn two_threads_answer_in_the_items_order() {
        let items: Vec<u64> = (0..40).collect();
        let square = |x: &u64| Some(x * x);
        let one = over(&items, 1, &|_, _| {}, &AtomicBool::new(false), square);
        let two = over(&items, 2, &|_, _| {}, &AtomicBool::new(false), square);
        assert_eq!(one, two);
        assert_eq!(two[7], Some(49));
    }

    /// Progress rises one by one to the total.
    #[test]
    fn progress_rises_to_the_total() {
        let items = [1, 2, 3, 4, 5];
        let seen = Mutex::new(Vec::new());
        let record = |d: usize, t: usize| seen.lock().unwrap().push((d, t));
        over(&items, 2, &record, &AtomicBool::new(false), |x| Some(*x));
        let seen = seen.into_inner().unwrap();
        assert_eq!(seen, (1..=5).map(|d| (d, 5)).collect::<Vec<_>>());
    }

    /// A set flag stops before any item starts.
    #[test]
    fn a_set_flag_starts_nothing() {
        let out = over(&[1, 2, 3], 2, &|_, _| {}, &AtomicBool::new(true), |x| {
            Some(*x)
        });
        assert_eq!(out, vec![None, None, None]);
    }
}
