"""Long Rust work releases the GIL, stops on Ctrl-C, and never lets a panic through."""

from __future__ import annotations

import os
import signal
import threading

import pytest

import druse

# (8,8) with n = 15 has 7,229,999,700 tableaux (hook-content, Stanley EC2 Cor. 7.21.4): walking
# them takes tens of seconds, so an answer within the test means the walk was cut short.
LONG = ((8, 8), 15)


@pytest.mark.skipif(os.name != "posix", reason="sends SIGINT to itself")
def test_ctrl_c_interrupts_a_long_walk() -> None:
    timer = threading.Timer(0.5, os.kill, args=(os.getpid(), signal.SIGINT))
    timer.start()
    try:
        with pytest.raises(KeyboardInterrupt):
            druse.count_by_enumeration(*LONG, threads=2)
    finally:
        timer.cancel()


def test_the_gil_is_released_while_rust_works() -> None:
    ticks = 0
    done = threading.Event()

    def count_ticks() -> None:
        nonlocal ticks
        while not done.is_set():
            ticks += 1  # runs only if the walk below does not hold the GIL

    ticker = threading.Thread(target=count_ticks)
    ticker.start()
    try:
        before = ticks  # read while this thread holds the GIL
        druse.count_by_enumeration((6, 4, 2), 9, threads=1)  # 5,350,344 tableaux
        during = ticks - before  # the ticker can only have moved if the walk let go of the GIL
    finally:
        done.set()
        ticker.join()
    assert during > 1000
