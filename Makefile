# Local checks and CI run the same commands. `make help` lists the targets.
VENV ?= .venv
# The interpreter for tests, benchmarks and lint tools: the project's venv when there is one (so
# nothing needs activating), else whatever `python` is. Override with PY=...
PY ?= $(if $(wildcard $(VENV)/bin/python),$(VENV)/bin/python,python)
RUFF = $(PY) -m ruff
MYPY = $(PY) -m mypy
PYTHON_DIRS = python tests benches examples
LOCK = flock /tmp/druse-build.lock
export PIP_DISABLE_PIP_VERSION_CHECK = 1

.PHONY: help demo check dev release fmt lint test test-rust test-py bench clean

help: ## list the targets
	@grep -E '^[a-z-]+:.*## ' $(MAKEFILE_LIST) | awk -F':.*## ' '{printf "  %-10s %s\n", $$1, $$2}'

$(VENV)/bin/python:
	python3 -m venv $(VENV)

demo: $(VENV)/bin/python ## fresh machine: build and install into .venv (release), run the demo scenario
	$(VENV)/bin/python -m pip install .
	$(VENV)/bin/python examples/scenario.py
	$(VENV)/bin/druse count 5,3 7
	$(VENV)/bin/druse crystal 4,2,2,1 6
	$(VENV)/bin/druse schur 2,2,1 4
	$(VENV)/bin/druse tableaux 3,2 4 --limit 5
	$(VENV)/bin/python examples/schubert_and_checks.py
	$(VENV)/bin/druse schubert 1,4,3,2
	$(VENV)/bin/druse pipe-dreams 2,5,1,4,3 --limit 1
	$(VENV)/bin/druse schubert-keys 2,5,1,4,3
	$(VENV)/bin/druse lr 3,2,1 2,1

check: $(VENV)/bin/python ## fresh machine: install with test and lint extras into .venv, run all tests
	$(VENV)/bin/python -m pip install ".[test,lint]"
	$(MAKE) test PY=$(VENV)/bin/python

dev: ## build the extension into the active venv (optimised, quick to link)
	$(LOCK) maturin develop --profile quick

release: ## build the extension into the active venv with the release profile (LTO)
	$(LOCK) maturin develop --release

fmt: ## format Rust and Python
	cargo fmt
	$(RUFF) format $(PYTHON_DIRS)

lint: ## rustfmt, clippy, ruff, mypy
	cargo fmt --check
	cargo clippy --all-targets --no-default-features -- -D warnings
	cargo clippy --all-targets -- -D warnings
	$(RUFF) format --check $(PYTHON_DIRS)
	$(RUFF) check $(PYTHON_DIRS)
	$(MYPY)
	$(MYPY) benches
	$(PY) -m mypy.stubtest druse._core  # the stub against the built module

test-rust: ## kernel tests, without Python
	cargo test --no-default-features

test-py: ## the pytest suite (slow cases included); exit code 5 (no tests) fails
	$(PY) -m pytest -q; rc=$$?; if [ $$rc -eq 5 ]; then echo "pytest collected no tests" >&2; exit 1; fi; exit $$rc

test: test-rust test-py ## all tests

bench: ## benchmarks on a release build, JSON in .benchmarks/
	@mkdir -p .benchmarks
	$(PY) -m pytest benches --benchmark-only --benchmark-json=.benchmarks/latest.json -q

clean: ## remove build products
	cargo clean
	rm -rf dist .pytest_cache .benchmarks
