/* exercise.h: what the fuzz targets (tests/fuzz/fuzz_*.c) and the regression suite
 * (tests/test_fuzz_regressions.c) do with one input, shared so that a reproducer replays
 * in the normal test build exactly as the fuzzer ran it.
 *
 * Each function feeds the bytes to an in-memory reader and, when the input is accepted,
 * does cheaply what a user would do next. It returns NULL when every promise held (a
 * clean error: code set and message non-empty; or a clean success), otherwise a
 * description of the broken promise (a static buffer). Crashes, leaks and undefined
 * behaviour are left to the sanitizers. */
#ifndef VOLEV_TESTS_FUZZ_EXERCISE_H
#define VOLEV_TESTS_FUZZ_EXERCISE_H

#include <stddef.h>

/* Scenario text (vl_scenario_parse, label "fuzz.cfg"); when it loads: the resolved
 * scenario must load back to identical values, the `validate` listing is printed to
 * memory, the model is built with its initial state and, with the hz_fit climate, its
 * environment and tendencies are evaluated once at the start age (no integration). */
const char *vl_fuzz_scenario(const unsigned char *data, size_t size);

/* Stellar-track CSV (vl_star_track_parse, label "fuzz.csv"); when it parses: a star over
 * exactly the track's ages (those of them a run may span, if any) must build, and its
 * state at nine ages across them must be finite, with a positive luminosity and nothing
 * negative. */
const char *vl_fuzz_track(const unsigned char *data, size_t size);

/* Candidate-catalogue CSV (vl_catalogue_parse, label "fuzz.csv"); when it parses: the
 * overrides of the first rows are formatted and applied to a default scenario (each
 * accepted or refused with a clean error). */
const char *vl_fuzz_catalogue(const unsigned char *data, size_t size);

#endif
