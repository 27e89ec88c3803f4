# volev: GNU make build. `make` builds build/volev; `make check` runs all tests;
# `make demo` installs missing packages (as root), builds, runs the demo and renders it.
# Switches: SAN=1 (ASan+UBSan), WERROR=1, V=1 (show commands), MPI=1 (an MPI build of
# `volev sweep` with mpicc, in build-mpi/ unless BUILD is given), PREFIX, DESTDIR, PYTHON
# (the Python 3 of `make check`'s python/tests).
# `make fuzz` builds the libFuzzer targets with clang in build-fuzz/ (scripts/fuzz.sh runs
# them); it calls this Makefile again with FUZZ=1, which is not meant to be set by hand.

VERSION := 0.1.0
PREFIX ?= /usr/local
DESTDIR ?=
CC ?= cc
FUZZ_CC ?= clang
# Debian's interpreter when present: python3-pandas (scripts/deps.sh) is installed for it, not
# for another python3 that may come first on PATH.
PYTHON ?= $(if $(wildcard /usr/bin/python3),/usr/bin/python3,python3)
ifeq ($(FUZZ),1)
override CC := $(FUZZ_CC)
override BUILD := build-fuzz
CFLAGS ?= -O1 -g
else ifeq ($(MPI),1)
CC := mpicc
BUILD ?= build-mpi
else
BUILD ?= build
endif

GIT_REV := $(shell git rev-parse --short=12 HEAD 2>/dev/null || echo unknown)
PKGS := gsl libconfig
# SUNDIALS (CVODE, the integrator) has no pkg-config file in Debian
SUNDIALS_LIBS := -lsundials_cvode -lsundials_nvecserial -lsundials_sunmatrixdense \
                 -lsundials_sunlinsoldense

WARN := -Wall -Wextra -Wpedantic -Wshadow -Wconversion -Wstrict-prototypes \
        -Wmissing-prototypes -Wno-sign-conversion
CFLAGS ?= -O2 -g
CFLAGS += -std=c17 $(WARN) -ffp-contract=off -Iinclude \
          -D_POSIX_C_SOURCE=200809L -DVL_VERSION='"$(VERSION)"' -DVL_GIT_REV='"$(GIT_REV)"'
# members of a sweep run on threads (OpenMP: GCC's libgomp); the library itself has no
# OpenMP, so the fuzz build (clang, library and fuzz targets only) does without it
ifneq ($(FUZZ),1)
CFLAGS += -fopenmp
LDFLAGS += -fopenmp
endif
ifeq ($(MPI),1)
CFLAGS += -DVL_MPI
endif
ifeq ($(WERROR),1)
CFLAGS += -Werror
endif
ifeq ($(SAN),1)
CFLAGS += -fsanitize=address,undefined -fno-omit-frame-pointer -fno-sanitize-recover=all
LDFLAGS += -fsanitize=address,undefined
endif
ifeq ($(FUZZ),1)
CFLAGS += -fsanitize=fuzzer-no-link,address,undefined -fno-omit-frame-pointer \
          -fno-sanitize-recover=all
LDFLAGS += -fsanitize=address,undefined
endif

PKG_CFLAGS = $(shell pkg-config --cflags $(PKGS) 2>/dev/null)
PKG_LIBS = $(shell pkg-config --libs $(PKGS) 2>/dev/null) $(SUNDIALS_LIBS)
CHECK_CFLAGS = $(shell pkg-config --cflags check 2>/dev/null)
CHECK_LIBS = $(shell pkg-config --libs check 2>/dev/null)

# the library: every layer folder of src/ but the program's (src/cli)
LIB_SRC := $(filter-out src/cli/%,$(wildcard src/*/*.c src/*/*/*.c))
CLI_SRC := $(wildcard src/cli/*.c)
TEST_SRC := $(wildcard tests/*.c) tests/fuzz/exercise.c
FUZZ_TARGETS := scenario track catalogue
FUZZ_OBJ := $(FUZZ_TARGETS:%=$(BUILD)/tests/fuzz/fuzz_%.o) $(BUILD)/tests/fuzz/exercise.o
FUZZ_BIN := $(FUZZ_TARGETS:%=build-fuzz/fuzz_%)
LIB_OBJ := $(LIB_SRC:%.c=$(BUILD)/%.o)
CLI_OBJ := $(CLI_SRC:%.c=$(BUILD)/%.o)
TEST_OBJ := $(TEST_SRC:%.c=$(BUILD)/%.o)
DEPS := $(LIB_OBJ:.o=.d) $(CLI_OBJ:.o=.d) $(TEST_OBJ:.o=.d) $(FUZZ_OBJ:.o=.d)

LIB := $(BUILD)/libvolev.a
BIN := $(BUILD)/volev
TESTBIN := $(BUILD)/run_tests

ifeq ($(V),1)
Q :=
else
Q := @
endif

.PHONY: all check check-run demo deps man install uninstall clean bench docs validation figures fuzz fuzz-dict
all: $(BIN)

$(BUILD)/%.o: %.c
	@mkdir -p $(dir $@)
	@$(if $(Q),echo "  CC  $<")
	$(Q)$(CC) $(CFLAGS) $(PKG_CFLAGS) -MMD -MP -c $< -o $@

$(BUILD)/tests/%.o: tests/%.c
	@mkdir -p $(dir $@)
	@$(if $(Q),echo "  CC  $<")
	$(Q)$(CC) $(CFLAGS) $(PKG_CFLAGS) $(CHECK_CFLAGS) -MMD -MP -c $< -o $@

# The git revision is compiled into output.o; rebuild it when the revision changes.
$(BUILD)/gitrev.txt: FORCE
	@mkdir -p $(BUILD)
	@echo "$(GIT_REV)" | cmp -s - $@ || echo "$(GIT_REV)" > $@
$(BUILD)/src/output/output.o: $(BUILD)/gitrev.txt
FORCE:

$(LIB): $(LIB_OBJ)
	@$(if $(Q),echo "  AR  $@")
	$(Q)rm -f $@ && ar rcs $@ $^

$(BIN): $(CLI_OBJ) $(LIB)
	@$(if $(Q),echo "  LD  $@")
	$(Q)$(CC) $(LDFLAGS) $(CLI_OBJ) $(LIB) $(PKG_LIBS) -lm -o $@

$(TESTBIN): $(TEST_OBJ) $(LIB)
	@$(if $(Q),echo "  LD  $@")
	$(Q)$(CC) $(LDFLAGS) $(TEST_OBJ) $(LIB) $(PKG_LIBS) $(CHECK_LIBS) -lm -o $@

# All tests: unit suites and command-line tests, one runner; then the Python module's
# tests with $(PYTHON) (python/tests: the plain-list tables always, the pandas ones where
# pandas imports; docs/python.md). Where mpicc exists the MPI build of the program
# (build-mpi/, without sanitizers: OpenMPI's own allocations would read as leaks) is made
# too, and the sweep tests run it on 2 ranks. The climate table
# cache of the runs (the program's and the suites' own) is a fresh folder of the build,
# never the user's; CHECK_CACHE=DIR reuses DIR instead (CI hands the sanitizer build the
# points the normal build computed: the same physics, so the same numbers).
MPICC := $(shell command -v mpicc 2>/dev/null)
ifneq ($(MPICC),)
MPI_BIN := build-mpi/volev
MPI_ENV := VOLEV_MPI_BIN=$(abspath $(MPI_BIN))
endif
# `make check` first makes sure the test packages are there (scripts/deps.sh --test: Check,
# OpenMPI, python3), then builds and runs everything (check-run).
check:
	@sh scripts/deps.sh --test
	@$(MAKE) --no-print-directory check-run

check-run: $(TESTBIN) $(BIN)
ifneq ($(MPICC),)
	@$(MAKE) --no-print-directory MPI=1 BUILD=build-mpi SAN= $(MPI_BIN)
endif
	$(if $(CHECK_CACHE),,rm -rf $(BUILD)/cache)
	VOLEV_BIN=$(abspath $(BIN)) VOLEV_TOP=$(abspath .) $(MPI_ENV) \
	    VOLEV_CACHE_DIR=$(or $(CHECK_CACHE),$(abspath $(BUILD)/cache)) \
	    CK_DEFAULT_TIMEOUT=120 $(TESTBIN)
	VOLEV_BIN=$(abspath $(BIN)) VOLEV_TOP=$(abspath .) \
	    VOLEV_CACHE_DIR=$(or $(CHECK_CACHE),$(abspath $(BUILD)/cache)) \
	    $(PYTHON) -B -m unittest discover -s python/tests -t python/tests

# libFuzzer targets (clang; library objects with -fsanitize=fuzzer-no-link,address,undefined,
# the targets linked with -fsanitize=fuzzer): build-fuzz/fuzz_{scenario,track,catalogue}.
# scripts/fuzz.sh builds and runs them; tests/fuzz/ holds the targets, seeds and regressions.
fuzz:
	@$(MAKE) --no-print-directory FUZZ=1 $(FUZZ_BIN)

ifeq ($(FUZZ),1)
.SECONDARY: $(FUZZ_OBJ)
$(BUILD)/fuzz_%: $(BUILD)/tests/fuzz/fuzz_%.o $(BUILD)/tests/fuzz/exercise.o $(LIB)
	@$(if $(Q),echo "  LD  $@")
	$(Q)$(CC) $(LDFLAGS) -fsanitize=fuzzer $^ $(PKG_LIBS) -lm -o $@
endif

# The scenario fuzzer's dictionary (keys, group names, choices) from the parameter tables.
fuzz-dict: $(BIN)
	@sh scripts/fuzz-dict.sh $(BIN) > tests/fuzz/scenario.dict.tmp
	@mv tests/fuzz/scenario.dict.tmp tests/fuzz/scenario.dict
	@echo "  GEN tests/fuzz/scenario.dict"

# Missing Debian packages: installed when root, otherwise the exact command is printed.
deps:
	@sh scripts/deps.sh

demo: deps
	@$(MAKE) --no-print-directory $(BIN)
	@sh scripts/demo.sh $(BIN)

# The parameter and column references are generated from the tables (tests check they are current).
docs: $(BIN)
	@{ echo "# Parameter reference"; echo; \
	   echo "Generated by \`make docs\` from the parameter tables (\`volev processes\`); do not edit."; \
	   echo "Units are those of the scenario file. Equations: docs/model.md."; echo; \
	   echo '```'; $(BIN) processes; echo '```'; } > docs/parameters.md
	@echo "  GEN docs/parameters.md"
	@$(BIN) processes --sources > docs/sources.md
	@echo "  GEN docs/sources.md"
	@{ echo "# Output columns"; echo; \
	   echo "Generated by \`make docs\` from the output schema (\`volev columns\`); do not edit."; \
	   echo "Equations behind each quantity: docs/model.md and docs/escape.md."; echo; \
	   $(BIN) columns; } > docs/columns.md
	@echo "  GEN docs/columns.md"

# Venus, Earth and Mars today against measurements: docs/validation.md.
validation: $(BIN)
	@sh scripts/validation.sh $(BIN)

# One figure of every kind from the bundled scenarios: docs/figures/*.png (docs/figures.md).
figures: $(BIN)
	@sh scripts/figures.sh $(BIN)

# Timings (docs/performance.md); the SciPy side by side only where a Python with SciPy
# exists (sh scripts/deps.sh --bench).
bench: $(BIN)
	@sh bench/run.sh $(BIN)
	@if command -v mpicc >/dev/null 2>&1; then $(MAKE) --no-print-directory MPI=1 BUILD=build-mpi SAN= build-mpi/volev; fi
	@sh bench/sweep.sh $(BIN) 1000 build-mpi/volev
	@if sh bench/scipy/compare.sh --have-scipy; then sh bench/scipy/compare.sh $(BIN); \
	 else echo "bench: SciPy comparison skipped: no Python with SciPy (sh scripts/deps.sh --bench)"; fi

install: $(BIN)
	install -d $(DESTDIR)$(PREFIX)/bin $(DESTDIR)$(PREFIX)/share/man/man1 \
	           $(DESTDIR)$(PREFIX)/share/volev/plots $(DESTDIR)$(PREFIX)/share/volev/scenarios \
	           $(DESTDIR)$(PREFIX)/share/doc/volev/figures
	install -m 755 $(BIN) $(DESTDIR)$(PREFIX)/bin/volev
	install -m 644 docs/volev.1 $(DESTDIR)$(PREFIX)/share/man/man1/volev.1
	install -m 644 plots/*.gp $(DESTDIR)$(PREFIX)/share/volev/plots/
	install -m 644 scenarios/*.cfg $(DESTDIR)$(PREFIX)/share/volev/scenarios/
	install -m 644 README.md docs/*.md docs/*.png $(DESTDIR)$(PREFIX)/share/doc/volev/
	install -m 644 docs/figures/* $(DESTDIR)$(PREFIX)/share/doc/volev/figures/

uninstall:
	rm -f $(DESTDIR)$(PREFIX)/bin/volev $(DESTDIR)$(PREFIX)/share/man/man1/volev.1
	rm -rf $(DESTDIR)$(PREFIX)/share/volev $(DESTDIR)$(PREFIX)/share/doc/volev

# The manual page on a terminal (installs man-db when missing: scripts/deps.sh --man).
man:
	@sh scripts/deps.sh --man
	@man -l docs/volev.1

clean:
	rm -rf $(BUILD) build-san build-mpi build-fuzz demo-out

-include $(DEPS)
