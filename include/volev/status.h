/* status.h: error codes and the message buffer filled by library functions.
 * The library never prints or exits; the command line maps codes to exit codes. */
#ifndef VOLEV_STATUS_H
#define VOLEV_STATUS_H

#include <stddef.h>

/* Status codes double as the program's exit codes (documented in docs/volev.1). */
enum vl_code {
    VL_OK = 0,          /* success */
    VL_ERR_INTERNAL = 1,/* a bug or an unexpected library failure */
    VL_ERR_USAGE = 2,   /* bad command line */
    VL_ERR_INPUT = 3,   /* bad scenario, override or data table */
    VL_ERR_NUMERIC = 4, /* integration failed (step underflow, non-finite state) */
    VL_ERR_IO = 5,      /* a file could not be read or written */
    VL_ERR_TOOL = 6,    /* an external program (gnuplot) is missing or failed */
    VL_ERR_STOPPED = 7  /* stopped on request (a signal): the program exits 128 + signal */
};

#define VL_MSG_MAX 1024
#define VL_PATH_MAX 1024

typedef struct vl_status {
    int code;                 /* enum vl_code */
    char file[VL_PATH_MAX];   /* file the message is about, "" if none */
    int line;                 /* 1-based line in file, 0 if unknown */
    char msg[VL_MSG_MAX];     /* human-readable message, no trailing newline */
} vl_status;

/* Reset st to VL_OK with empty message. */
void vl_status_clear(vl_status *st);

/* Record an error (printf-style message) and return code. file may be NULL. */
int vl_fail(vl_status *st, int code, const char *file, int line, const char *fmt, ...)
    __attribute__((format(printf, 5, 6)));

/* Format st as "FILE:LINE: message" (or "FILE: message", or "message") into buf. */
void vl_status_format(const vl_status *st, char *buf, size_t n);

#endif
