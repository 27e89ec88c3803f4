/* catalogue.h: the planet catalogue, a CSV file with one candidate planet per row whose
 * values override the base scenario (format: docs/catalogue.md). The reader validates
 * the file completely and never prints; errors come back in a vl_status. */
#ifndef VOLEV_CATALOGUE_H
#define VOLEV_CATALOGUE_H

#include <stddef.h>

#include "volev/status.h"

/* Limits of the format (each exceeded limit is an input error). */
#define VL_CATALOGUE_LINE_MAX 65536     /* bytes per line, line end excluded */
#define VL_CATALOGUE_COLS_MAX 256       /* columns, the name column included */
#define VL_CATALOGUE_ROWS_MAX 1000000   /* candidates */
#define VL_CATALOGUE_FIELD_MAX 255      /* bytes per field after unquoting and trimming */

/* A validated catalogue. names[r] and the cell texts of row r live in the single
 * allocation cells[r]; release everything with vl_catalogue_free only. */
typedef struct vl_catalogue {
    size_t ncols;            /* value columns (name column excluded) */
    char **keys;             /* scenario key of each value column */
    char **headers;          /* header text of each value column, as written */
    size_t nrows;            /* candidates */
    char **names;            /* candidate names */
    char ***cells;           /* cells[r][c]: override text, or NULL for an empty cell */
    int *lines;              /* source line of each candidate */
    int header_line;         /* source line of the header */
} vl_catalogue;

/* Reads and validates path; on error returns NULL and fills st (VL_ERR_IO when the
 * file cannot be read, VL_ERR_INPUT for its content, VL_ERR_INTERNAL when out of memory). */
vl_catalogue *vl_catalogue_read(const char *path, vl_status *st);

/* The same from a memory buffer (len bytes, may contain NULs, which are rejected);
 * label is used as the file name in messages (may be NULL). */
vl_catalogue *vl_catalogue_parse(const char *text, size_t len, const char *label, vl_status *st);

/* Releases c and everything it owns; accepts NULL. */
void vl_catalogue_free(vl_catalogue *c);

/* Formats the overrides of row r, "KEY=VALUE" for each non-empty cell in column order,
 * into out (room for at least ncols pointers; the caller frees each with free()) and
 * returns how many. Returns 0 when r is out of range, and SIZE_MAX when out of memory
 * (then nothing is left allocated). */
size_t vl_catalogue_overrides(const vl_catalogue *c, size_t r, char **out);

/* Scenario key of a short column name (e.g. "orbit_au" -> "planet.orbit_au"), or NULL. */
const char *vl_catalogue_short_key(const char *name);

#endif
