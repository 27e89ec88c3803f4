/* fuzz_track.c: libFuzzer target for the stellar-track CSV (vl_star_track_parse) and the
 * cheap steps after it (tests/fuzz/exercise.c). Built by `make fuzz`, run by
 * scripts/fuzz.sh. A broken promise aborts, so libFuzzer keeps the input as a crash. */
#include <stddef.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>

#include "exercise.h"

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size);

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    const char *why = vl_fuzz_track(data, size);
    if (why) {
        fprintf(stderr, "fuzz_track: %s\n", why);
        abort();
    }
    return 0;
}
