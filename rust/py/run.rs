//! Running kernels without the GIL, interruptible by Ctrl-C, with panics turned into `InternalError`.
use super::errors::InternalError;
use crate::error::Error;
use crate::job::Job;
use pyo3::prelude::*;
use std::sync::mpsc::{self, RecvTimeoutError};
use std::thread;
use std::time::Duration;

const TICK: Duration = Duration::from_millis(50);

/// Runs `work` without the GIL on a scoped thread, while the calling thread watches for Ctrl-C every TICK.
pub fn run_detached<T: Send>(
    py: Python<'_>,
    work: impl FnOnce(&Job) -> Result<T, Error> + Send,
) -> PyResult<T> {
    let job = &Job::default();
    let mut interrupt = None;
    let outcome = py.detach(|| {
        let (tx, rx) = mpsc::channel::<()>();
        thread::scope(|s| {
            let worker = s.spawn(move || {
                let _alive = tx; // dropped when `work` returns or panics, which ends the wait
                work(job)
            });
            while let Err(RecvTimeoutError::Timeout) = rx.recv_timeout(TICK) {
                if interrupt.is_none() {
                    #[allow(clippy::redundant_closure_for_method_calls)]
                    // the method is not general over lifetimes
                    let signals = Python::attach(|py| py.check_signals());
                    interrupt = signals.err();
                    job.set_stop(interrupt.is_some());
                }
            }
            worker.join() // joining takes in a panic, so `scope` does not raise it again
        })
    });
    match (interrupt, outcome) {
        (Some(e), _) => Err(e),
        (None, Ok(result)) => result.map_err(PyErr::from),
        (None, Err(_panic)) => Err(InternalError::new_err(
            "druse internal error (a Rust panic); please report it with the call that caused it",
        )),
    }
}

/// For quick calls that keep the GIL: still never lets a panic reach Python as `PanicException`.
pub fn run_quick<T>(work: impl FnOnce() -> Result<T, Error>) -> PyResult<T> {
    match std::panic::catch_unwind(std::panic::AssertUnwindSafe(work)) {
        Ok(result) => result.map_err(PyErr::from),
        Err(_panic) => Err(InternalError::new_err(
            "druse internal error (a Rust panic); please report it with the call that caused it",
        )),
    }
}
