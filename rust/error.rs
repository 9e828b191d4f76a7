//! The one error type of the kernels. Its `Display` is the message the user reads.
#![deny(unsafe_code)]

use std::fmt;

#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Error {
    /// An argument broke a rule; the text names the argument, the rule and the value.
    InvalidArgument(String),
    /// The request would need more memory than allowed: what, its estimated size, and what to use instead.
    TooLarge {
        what: String,
        bytes: u128,
        instead: String,
    },
    /// A stop was requested (Ctrl-C) while the kernel ran.
    Interrupted,
    /// A kernel found its own invariant broken: a bug in druse, never the caller's fault.
    Internal(String),
}

impl Error {
    pub fn invalid(msg: impl Into<String>) -> Self {
        Error::InvalidArgument(msg.into())
    }
}

impl fmt::Display for Error {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Error::InvalidArgument(m) => f.write_str(m),
            Error::TooLarge {
                what,
                bytes,
                instead,
            } => write!(
                f,
                "{what} would need about {} of memory, more than allowed; {instead}",
                human_bytes(*bytes)
            ),
            Error::Interrupted => f.write_str("interrupted"),
            Error::Internal(m) => write!(f, "druse internal error: {m}; please report it"),
        }
    }
}

impl std::error::Error for Error {}

/// `1.5 GB`-style size for messages.
#[allow(clippy::cast_precision_loss)]
pub fn human_bytes(bytes: u128) -> String {
    let units = ["B", "kB", "MB", "GB", "TB", "PB", "EB"];
    let mut value = bytes as f64;
    let mut unit = 0;
    while value >= 1000.0 && unit + 1 < units.len() {
        value /= 1000.0;
        unit += 1;
    }
    if unit == 0 {
        format!("{bytes} B")
    } else if value >= 1000.0 {
        format!("{value:.3e} {}", units[unit])
    } else {
        format!("{value:.1} {}", units[unit])
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn sizes_read_well() {
        assert_eq!(human_bytes(12), "12 B");
        assert_eq!(human_bytes(1_500_000_000), "1.5 GB");
    }
}
