//! ringheat command line: reads arguments, calls the library, prints.

fn main() {}
