//! One edit in the planner, the engine's re-evaluation and a full redraw at 120x40: the
//! work done between a key press and the next frame.

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use turnstack::files::demo_build;
use turnstack::tui::{Action, App, view};

fn main() {
    divan::main();
}

#[divan::bench]
fn edit_evaluate_redraw_120x40(bencher: divan::Bencher) {
    let mut app = App::new(demo_build().expect("demo"), None);
    let mut terminal = Terminal::new(TestBackend::new(120, 40)).unwrap();
    // Select the tape section #2 and alternate one wrap more and one fewer, so every
    // iteration is a real edit (validate, evaluate, undo history) and a full frame.
    app.ui.stack_sel = 1;
    let mut up = true;
    bencher.bench_local(|| {
        app.update(if up { Action::More } else { Action::Less });
        up = !up;
        terminal.draw(|f| view::draw(&app, f)).unwrap();
        divan::black_box(terminal.backend().buffer().area);
    });
}

#[divan::bench]
fn redraw_only_120x40(bencher: divan::Bencher) {
    let app = App::new(demo_build().expect("demo"), None);
    let mut terminal = Terminal::new(TestBackend::new(120, 40)).unwrap();
    bencher.bench_local(|| {
        terminal.draw(|f| view::draw(&app, f)).unwrap();
    });
}
