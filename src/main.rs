//! The `turnstack` binary: everything lives in the library.

fn main() -> std::process::ExitCode {
    turnstack::cli::main()
}
