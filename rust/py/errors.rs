//! The only mapping from kernel errors to Python exceptions.
use crate::error::Error;
use pyo3::exceptions::{PyKeyboardInterrupt, PyValueError};
use pyo3::PyErr;

pyo3::import_exception!(druse.errors, TooLargeError);
pyo3::import_exception!(druse.errors, InternalError);

impl From<Error> for PyErr {
    fn from(err: Error) -> PyErr {
        match err {
            Error::InvalidArgument(_) => PyValueError::new_err(err.to_string()),
            Error::TooLarge { .. } => TooLargeError::new_err(err.to_string()),
            Error::Interrupted => PyKeyboardInterrupt::new_err("interrupted"),
            Error::Internal(_) => InternalError::new_err(err.to_string()),
        }
    }
}
