//! Large buffers, backed by transparent huge pages where the OS offers them: first touch of a
//! fresh gigabyte costs about a second in 4 kB page faults, and far less in 2 MB pages.
#![allow(unsafe_code)] // one madvise call on memory this module has just allocated

/// Buffers smaller than this are left to the allocator as they are.
const HUGE_FROM: usize = 1 << 22;

/// A `Vec` of `len` copies of `value`. On Linux, a large one is marked MADV_HUGEPAGE before its
/// pages are first touched. The hint is only a hint: if the kernel refuses it, only speed changes.
pub fn filled<T: Copy>(len: usize, value: T) -> Vec<T> {
    let mut v: Vec<T> = Vec::with_capacity(len);
    let bytes = len.saturating_mul(std::mem::size_of::<T>());
    #[cfg(target_os = "linux")]
    if bytes >= HUGE_FROM {
        let page = 4096;
        let addr = v.as_ptr() as usize;
        let (start, end) = (addr.div_ceil(page) * page, (addr + bytes) / page * page);
        if end > start {
            // SAFETY: [start, end) lies inside the allocation of `v`, which stays alive and is not
            // moved here; MADV_HUGEPAGE changes only how the kernel backs the pages, never what
            // they hold, so no Rust invariant depends on the call.
            unsafe {
                libc::madvise(start as *mut libc::c_void, end - start, libc::MADV_HUGEPAGE);
            }
        }
    }
    v.resize(len, value);
    v
}

#[cfg(test)]
mod tests {
    #[test]
    fn large_buffers_hold_the_value() {
        let v = super::filled(5 << 20, 0u8);
        assert!(v.iter().all(|&b| b == 0));
        let w = super::filled(1 << 20, -1i64);
        assert_eq!((w.len(), w[12345]), (1 << 20, -1));
    }
}
