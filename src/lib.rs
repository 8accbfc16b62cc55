//! Cross-crate checks for Pitchframe; see `tests/` and `examples/`.
