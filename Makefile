# volev: GNU make build. `make` builds build/volev; `make check` runs all tests;
# `make demo` installs missing packages (as root), builds, runs the demo and renders it.
# Switches: SAN=1 (ASan+UBSan), WERROR=1, V=1 (show commands), PREFIX, DESTDIR.

VERSION := 0.1.0
PREFIX ?= /usr/local
DESTDIR ?=
CC ?= cc
BUILD ?= build

GIT_REV := $(shell git rev-parse --short=12 HEAD 2>/dev/null || echo unknown)
PKGS := gsl libconfig

WARN := -Wall -Wextra -Wpedantic -Wshadow -Wconversion -Wstrict-prototypes \
        -Wmissing-prototypes -Wno-sign-conversion
CFLAGS ?= -O2 -g
CFLAGS += -std=c17 $(WARN) -ffp-contract=off -Iinclude \
          -D_POSIX_C_SOURCE=200809L -DVL_VERSION='"$(VERSION)"' -DVL_GIT_REV='"$(GIT_REV)"'
ifeq ($(WERROR),1)
CFLAGS += -Werror
endif
ifeq ($(SAN),1)
CFLAGS += -fsanitize=address,undefined -fno-omit-frame-pointer -fno-sanitize-recover=all
LDFLAGS += -fsanitize=address,undefined
endif

PKG_CFLAGS = $(shell pkg-config --cflags $(PKGS) 2>/dev/null)
PKG_LIBS = $(shell pkg-config --libs $(PKGS) 2>/dev/null)
CHECK_CFLAGS = $(shell pkg-config --cflags check 2>/dev/null)
CHECK_LIBS = $(shell pkg-config --libs check 2>/dev/null)

LIB_SRC := $(wildcard src/*.c) $(wildcard src/processes/*.c)
CLI_SRC := $(wildcard src/cli/*.c)
TEST_SRC := $(wildcard tests/*.c)
LIB_OBJ := $(LIB_SRC:%.c=$(BUILD)/%.o)
CLI_OBJ := $(CLI_SRC:%.c=$(BUILD)/%.o)
TEST_OBJ := $(TEST_SRC:%.c=$(BUILD)/%.o)
DEPS := $(LIB_OBJ:.o=.d) $(CLI_OBJ:.o=.d) $(TEST_OBJ:.o=.d)

LIB := $(BUILD)/libvolev.a
BIN := $(BUILD)/volev
TESTBIN := $(BUILD)/run_tests

ifeq ($(V),1)
Q :=
else
Q := @
endif

.PHONY: all check demo deps install uninstall clean bench docs-params
all: $(BIN)

$(BUILD)/%.o: %.c
	@mkdir -p $(dir $@)
	@$(if $(Q),echo "  CC  $<")
	$(Q)$(CC) $(CFLAGS) $(PKG_CFLAGS) -MMD -MP -c $< -o $@

$(BUILD)/tests/%.o: tests/%.c
	@mkdir -p $(dir $@)
	@$(if $(Q),echo "  CC  $<")
	$(Q)$(CC) $(CFLAGS) $(PKG_CFLAGS) $(CHECK_CFLAGS) -MMD -MP -c $< -o $@

$(LIB): $(LIB_OBJ)
	@$(if $(Q),echo "  AR  $@")
	$(Q)rm -f $@ && ar rcs $@ $^

$(BIN): $(CLI_OBJ) $(LIB)
	@$(if $(Q),echo "  LD  $@")
	$(Q)$(CC) $(LDFLAGS) $(CLI_OBJ) $(LIB) $(PKG_LIBS) -lm -o $@

$(TESTBIN): $(TEST_OBJ) $(LIB)
	@$(if $(Q),echo "  LD  $@")
	$(Q)$(CC) $(LDFLAGS) $(TEST_OBJ) $(LIB) $(PKG_LIBS) $(CHECK_LIBS) -lm -o $@

# All tests: unit suites and command-line tests, one runner.
check: $(TESTBIN) $(BIN)
	VOLEV_BIN=$(abspath $(BIN)) VOLEV_TOP=$(abspath .) CK_DEFAULT_TIMEOUT=120 $(TESTBIN)

# Missing Debian packages: installed when root, otherwise the exact command is printed.
deps:
	@sh scripts/deps.sh

demo: deps
	@$(MAKE) --no-print-directory $(BIN)
	@sh scripts/demo.sh $(BIN)

bench: $(BIN)
	@sh bench/run.sh $(BIN)

install: $(BIN)
	install -d $(DESTDIR)$(PREFIX)/bin $(DESTDIR)$(PREFIX)/share/man/man1 \
	           $(DESTDIR)$(PREFIX)/share/volev/plots $(DESTDIR)$(PREFIX)/share/volev/scenarios
	install -m 755 $(BIN) $(DESTDIR)$(PREFIX)/bin/volev
	install -m 644 docs/volev.1 $(DESTDIR)$(PREFIX)/share/man/man1/volev.1
	install -m 644 plots/*.gp $(DESTDIR)$(PREFIX)/share/volev/plots/
	install -m 644 scenarios/*.cfg $(DESTDIR)$(PREFIX)/share/volev/scenarios/

uninstall:
	rm -f $(DESTDIR)$(PREFIX)/bin/volev $(DESTDIR)$(PREFIX)/share/man/man1/volev.1
	rm -rf $(DESTDIR)$(PREFIX)/share/volev

clean:
	rm -rf $(BUILD) demo-out

-include $(DEPS)
