/* registry.h: compile-time indices of the registered processes (processes.def order),
 * for processes that read another process's switch or parameters. Private to src/. */
#ifndef VOLEV_PROCESSES_REGISTRY_H
#define VOLEV_PROCESSES_REGISTRY_H

enum vl_process_index {
#define VL_PROCESS(name) VL_PROC_##name,
#include "processes.def"
#undef VL_PROCESS
    VL_PROC_COUNT
};

#endif
