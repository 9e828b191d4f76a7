"""Slow, obvious pure-Python oracles that the Rust kernels are compared against.

Nothing here imports druse: each module recomputes its object from the definitions, favouring
code that can be checked by reading over code that is fast.
"""
