# Local checks and CI run the same commands. `make help` lists the targets.
PY ?= python
LOCK = flock /tmp/druse-build.lock

.PHONY: help dev release fmt lint test test-rust test-py bench clean

help: ## list the targets
	@grep -E '^[a-z-]+:.*## ' $(MAKEFILE_LIST) | awk -F':.*## ' '{printf "  %-10s %s\n", $$1, $$2}'

dev: ## build the extension into the active venv (optimised, quick to link)
	$(LOCK) maturin develop --profile quick

release: ## build the extension into the active venv with the release profile (LTO)
	$(LOCK) maturin develop --release

fmt: ## format Rust and Python
	cargo fmt
	ruff format python tests benches

lint: ## rustfmt, clippy, ruff, mypy
	cargo fmt --check
	cargo clippy --all-targets --no-default-features -- -D warnings
	ruff format --check python tests benches
	ruff check python tests benches
	mypy

test-rust: ## kernel tests, without Python
	cargo test --no-default-features

test-py: ## the pytest suite (slow cases included); exit code 5 (no tests) fails
	$(PY) -m pytest -q; rc=$$?; if [ $$rc -eq 5 ]; then echo "pytest collected no tests" >&2; exit 1; fi; exit $$rc

test: test-rust test-py ## all tests

bench: ## benchmarks on a release build, JSON in .benchmarks/
	$(PY) -m pytest benches --benchmark-only --benchmark-json=.benchmarks/latest.json -q

clean: ## remove build products
	cargo clean
	rm -rf dist .pytest_cache .benchmarks
