"""Shared pytest configuration: hypothesis profiles, chosen with DRUSE_HYPOTHESIS_PROFILE."""

import os

from hypothesis import settings

settings.register_profile("ci", max_examples=50, derandomize=True, deadline=None)
settings.register_profile("deep", max_examples=2000, deadline=None)
settings.load_profile(os.environ.get("DRUSE_HYPOTHESIS_PROFILE", "ci"))
