//! User text as an error message shows it.
//!
//! A message quotes what the user typed so they can find it, but a plan
//! file is anybody's text: a value can hold a newline that would split the
//! message, a terminal escape that would recolour the terminal, or twenty
//! thousand characters. [`shown`] keeps the message one readable line.

/// Characters of user text quoted whole; longer text is cut with an ellipsis.
pub const MAX_SHOWN_CHARS: usize = 40;

/// `text` made safe to quote in a one-line message: control characters
/// written as escapes (`\n`, `\u{1b}`) and anything past
/// [`MAX_SHOWN_CHARS`] cut off with "…".
///
/// ```
/// use pitchframe_geometry::shown::shown;
/// assert_eq!(shown("in\nmm"), "in\\nmm");
/// assert_eq!(shown("\u{1b}[31min"), "\\u{1b}[31min");
/// assert_eq!(shown(&"m".repeat(100)).chars().count(), 41);
/// ```
pub fn shown(text: &str) -> String {
    let cut = text.char_indices().nth(MAX_SHOWN_CHARS).map(|(at, _)| at);
    let mut out = escaped(cut.map_or(text, |at| &text[..at]));
    if cut.is_some() {
        out.push('…');
    }
    out
}

/// `text` whole, with its control characters written as escapes, so it
/// stays on one line and cannot steer a terminal.
pub fn escaped(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for c in text.chars() {
        if c.is_control() {
            out.extend(c.escape_debug());
        } else {
            out.push(c);
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn plain_text_is_unchanged() {
        assert_eq!(shown("24' 6-3/8\""), "24' 6-3/8\"");
        assert_eq!(shown(""), "");
    }

    #[test]
    fn text_at_the_limit_is_whole_and_past_it_is_cut() {
        let at_limit = "x".repeat(MAX_SHOWN_CHARS);
        assert_eq!(shown(&at_limit), at_limit);
        let over = "x".repeat(MAX_SHOWN_CHARS + 1);
        assert_eq!(shown(&over), format!("{at_limit}…"));
    }

    #[test]
    fn nothing_shown_is_a_control_character() {
        let hostile = "\u{7}\u{1b}[2J\r\n\t\u{0}\u{9b}end";
        let s = shown(hostile);
        assert!(!s.chars().any(char::is_control), "{s:?}");
        assert!(s.ends_with("end"));
    }
}
