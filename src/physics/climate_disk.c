/* climate_disk.c: the column climate's tables on disk (climate_disk.h). Stub: caching
 * off until the cache is written. */
#include "climate_disk.h"

#include "volev/climate.h"

void vl_ct_disk_load(uint64_t key, void (*fn)(void *ctx, const int idx[VL_CT_NDIM], int j,
                                              const vl_column_point *p),
                     void *ctx)
{
    (void)key;
    (void)fn;
    (void)ctx;
}

void vl_ct_disk_note(uint64_t key, const int idx[VL_CT_NDIM], int j, const vl_column_point *p)
{
    (void)key;
    (void)idx;
    (void)j;
    (void)p;
}

int vl_climate_cache_configure(const char *folder, vl_status *st)
{
    (void)folder;
    (void)st;
    return VL_OK;
}

void vl_climate_cache_flush(void) {}
