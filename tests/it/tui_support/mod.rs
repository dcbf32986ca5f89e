//! Shared helpers for the planner's tests: an App on the demo build, key presses, and the
//! text of a rendered screen.
#![allow(dead_code)]

use ratatui::Terminal;
use ratatui::backend::TestBackend;
use ratatui::buffer::Buffer;
use ratatui::crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use turnstack::files::demo_build;
use turnstack::tui::theme::Theme;
use turnstack::tui::{App, view};

/// The planner on examples/bench-forward.toml: the interleaved build with the reset winding
/// bifilar on both primary halves and a partial first layer, for the drawing's tests.
pub fn bench_app() -> App {
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/bench-forward.toml");
    let b = turnstack::files::load_build(&path).expect("the bench example loads");
    let mut app = App::new(
        b,
        Some(
            path.strip_prefix(env!("CARGO_MANIFEST_DIR"))
                .unwrap()
                .to_path_buf(),
        ),
    );
    app.ui.theme = Theme::plain();
    turnstack::tui::run::refresh_library(&mut app);
    app
}

/// The planner on the demo build it opens with no file (each winding in one section).
pub fn demo_app() -> App {
    let mut app = App::new(demo_build().expect("the demo build loads"), None);
    app.ui.theme = Theme::plain();
    turnstack::tui::run::refresh_library(&mut app);
    app
}

pub fn text_of(buf: &Buffer) -> Vec<String> {
    let a = buf.area;
    (a.top()..a.bottom())
        .map(|y| {
            let mut line = String::new();
            let mut x = a.left();
            while x < a.right() {
                let s = buf[(x, y)].symbol();
                line.push_str(s);
                x += unicode_width::UnicodeWidthStr::width(s).max(1) as u16;
            }
            line
        })
        .collect()
}

pub fn render(app: &App, w: u16, h: u16) -> Vec<String> {
    let mut terminal = Terminal::new(TestBackend::new(w, h)).unwrap();
    terminal.draw(|f| view::draw(app, f)).unwrap();
    text_of(terminal.backend().buffer())
}

pub fn screen(app: &App, w: u16, h: u16) -> String {
    render(app, w, h).join("\n")
}

pub fn key(c: char) -> KeyEvent {
    KeyEvent::new(KeyCode::Char(c), KeyModifiers::NONE)
}

pub fn code(c: KeyCode) -> KeyEvent {
    KeyEvent::new(c, KeyModifiers::NONE)
}

/// Press keys given as text: plain characters, and <enter>, <esc>, <tab>, <up>, <down>,
/// <bs>, <del> for the others.
pub fn press(app: &mut App, keys: &str) -> Vec<turnstack::tui::Effect> {
    let mut effects = Vec::new();
    let mut rest = keys;
    while !rest.is_empty() {
        let ev = if let Some(r) = rest.strip_prefix('<') {
            let end = r.find('>').expect("closing >");
            let name = &r[..end];
            rest = &r[end + 1..];
            code(match name {
                "enter" => KeyCode::Enter,
                "esc" => KeyCode::Esc,
                "tab" => KeyCode::Tab,
                "up" => KeyCode::Up,
                "down" => KeyCode::Down,
                "bs" => KeyCode::Backspace,
                "del" => KeyCode::Delete,
                other => panic!("unknown key <{other}>"),
            })
        } else {
            let c = rest.chars().next().unwrap();
            rest = &rest[c.len_utf8()..];
            key(c)
        };
        if let Some(e) = app.handle_key(&ev) {
            effects.push(e);
        }
    }
    effects
}

/// Press keys and carry out every effect they give, as the run loop does (files are read
/// and written, the overwrite question is asked).
pub fn drive(app: &mut App, keys: &str) {
    for e in press(app, keys) {
        turnstack::tui::run::perform(app, e);
    }
}

/// Wait for the search or design under way and hand its result to the App, as the run
/// loop does on its next tick. Panics when no job runs or it takes over two minutes.
pub fn finish_job(app: &mut App) {
    assert!(app.job.is_some(), "no job under way");
    let end = std::time::Instant::now() + std::time::Duration::from_secs(120);
    while !app.poll_job() {
        assert!(std::time::Instant::now() < end, "the job did not finish");
        std::thread::sleep(std::time::Duration::from_millis(5));
    }
}
