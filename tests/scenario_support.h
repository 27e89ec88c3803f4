/* scenario_support.h: helpers shared by test_scenario.c and test_scenario_write.c. */
#ifndef VOLEV_TESTS_SCENARIO_SUPPORT_H
#define VOLEV_TESTS_SCENARIO_SUPPORT_H

#include <stddef.h>

#include "volev/scenario.h"

extern char vl_scen_tmp_dir[512];  /* the test case's temporary folder */
extern char vl_scen_cfg_path[1024]; /* the last file written */

/* A fresh temporary folder per test case / its removal (a Check fixture pair). */
void vl_scen_make_dir(void);
void vl_scen_remove_dir(void);
/* Writes text to the folder as name (or x.cfg) and returns the path (static buffer). */
const char *vl_scen_write_named(const char *name, const char *text);
const char *vl_scen_write_cfg(const char *text);
/* Loads text written as x.cfg. */
vl_scenario *vl_scen_load_text(const char *text, vl_status *st);
/* Global index of a full key; fails the test if there is none. */
size_t vl_scen_index_of(const char *key);
/* Loading text fails with VL_ERR_INPUT at line, naming the file, and the message
 * contains each of the (up to two) needles. */
void vl_scen_expect_error(const char *text, int line, const char *needle, const char *needle2);
/* Applying the override to a valid file fails with a --set message containing needle. */
void vl_scen_expect_override_error(const char *assignment, const char *needle);
/* Every stored value of a and b is identical, bit for bit. */
void vl_scen_assert_same_values(const vl_scenario *a, const vl_scenario *b);
/* Writes sc resolved into the folder as resolved.cfg and loads it back. */
vl_scenario *vl_scen_round_trip(const vl_scenario *sc);

#endif
