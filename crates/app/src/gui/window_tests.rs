//! Whole-window tests: the app state driven through its widgets.
