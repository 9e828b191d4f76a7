//! Large zeroed buffers, backed by transparent huge pages where the OS offers them: a fresh
//! buffer of a gigabyte costs about a second in 4 kB page faults, and far less in 2 MB pages.
#![allow(unsafe_code)] // one madvise call on memory this module has just allocated

/// Buffers smaller than this are left to the allocator as they are.
const HUGE_FROM: usize = 1 << 22;

/// A zeroed `Vec<u8>` of `len` bytes; on Linux, large ones are marked MADV_HUGEPAGE before first
/// touch. The hint is only a hint: if the kernel refuses it, nothing changes but the speed.
pub fn zeroed(len: usize) -> Vec<u8> {
    let v = vec![0u8; len];
    #[cfg(target_os = "linux")]
    if len >= HUGE_FROM {
        let page = 4096;
        let addr = v.as_ptr() as usize;
        let start = addr.div_ceil(page) * page;
        let end = (addr + len) / page * page;
        if end > start {
            // SAFETY: [start, end) lies inside the allocation of `v`, which stays alive and is not
            // moved here; MADV_HUGEPAGE changes only how the kernel backs the pages, never what
            // they hold, so no Rust invariant depends on the call.
            unsafe {
                libc::madvise(start as *mut libc::c_void, end - start, libc::MADV_HUGEPAGE);
            }
        }
    }
    v
}

#[cfg(test)]
mod tests {
    #[test]
    fn large_buffers_are_zero() {
        let v = super::zeroed(5 << 20);
        assert!(v.iter().all(|&b| b == 0));
        assert_eq!(v.len(), 5 << 20);
    }
}
