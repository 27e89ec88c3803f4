/* climate_disk.h: the column climate's tables kept on disk between runs
 * (climate_disk.c), private to src/physics. A table's points are appended, as they are
 * computed, to one file per table key in the cache folder, and read back when a process
 * first makes that table, so a point is computed once per machine. Records carry their
 * key, indices and a checksum; a torn or foreign record is skipped, never trusted. */
#ifndef VOLEV_CLIMATE_DISK_H
#define VOLEV_CLIMATE_DISK_H

#include <stdint.h>

#include "climate_table.h"

/* Every point of the table file for key in the cache folder: fn(ctx, idx, j, point) for
 * each valid record (nothing when caching is off or the file is missing). */
void vl_ct_disk_load(uint64_t key, void (*fn)(void *ctx, const int idx[VL_CT_NDIM], int j,
                                              const vl_column_point *p),
                     void *ctx);

/* Record a newly computed point of the table for key (buffered; written by
 * vl_climate_cache_flush, or when the buffer fills). Nothing when caching is off. */
void vl_ct_disk_note(uint64_t key, const int idx[VL_CT_NDIM], int j, const vl_column_point *p);

#endif
