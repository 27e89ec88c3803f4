/* registry.c: the table of every process (processes.def). */
#include <string.h>

#include "volev/process.h"

#define VL_PROCESS(name) extern const vl_process vl_process_##name;
#include "processes.def"
#undef VL_PROCESS

const vl_process *const vl_processes[] = {
#define VL_PROCESS(name) &vl_process_##name,
#include "processes.def"
#undef VL_PROCESS
};

const size_t vl_nprocesses = sizeof vl_processes / sizeof vl_processes[0];

int vl_process_find(const char *name)
{
    for (size_t i = 0; i < vl_nprocesses; i++)
        if (strcmp(vl_processes[i]->name, name) == 0)
            return (int)i;
    return -1;
}
