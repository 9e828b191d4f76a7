//! `Job`: the stop flag and progress counter that long kernel loops poll.
#![deny(unsafe_code)]

use crate::error::Error;
use std::sync::atomic::{AtomicBool, AtomicU64, Ordering};

/// Shared between a kernel (possibly on several rayon threads) and the thread that watches for Ctrl-C.
#[derive(Debug, Default)]
pub struct Job {
    stop: AtomicBool,
    done: AtomicU64,
}

impl Job {
    /// Records `items` more units of work and fails with `Interrupted` once a stop was requested.
    /// One relaxed load and one relaxed add: call it every few thousand items, not per item.
    #[inline]
    pub fn checkpoint(&self, items: u64) -> Result<(), Error> {
        self.done.fetch_add(items, Ordering::Relaxed);
        if self.stop.load(Ordering::Relaxed) {
            Err(Error::Interrupted)
        } else {
            Ok(())
        }
    }

    pub fn set_stop(&self, stop: bool) {
        self.stop.store(stop, Ordering::Relaxed);
    }

    pub fn done(&self) -> u64 {
        self.done.load(Ordering::Relaxed)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn stops_when_asked() {
        let job = Job::default();
        assert!(job.checkpoint(5).is_ok());
        job.set_stop(true);
        assert_eq!(job.checkpoint(1), Err(Error::Interrupted));
        assert_eq!(job.done(), 6);
    }
}
