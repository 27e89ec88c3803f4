/* status.c: error codes and messages. */
#include "volev/status.h"

#include <stdarg.h>
#include <stdio.h>
#include <string.h>

void vl_status_clear(vl_status *st)
{
    st->code = VL_OK;
    st->file[0] = '\0';
    st->line = 0;
    st->msg[0] = '\0';
}

int vl_fail(vl_status *st, int code, const char *file, int line, const char *fmt, ...)
{
    va_list ap;
    st->code = code;
    snprintf(st->file, sizeof st->file, "%s", file ? file : "");
    st->line = line;
    va_start(ap, fmt);
    vsnprintf(st->msg, sizeof st->msg, fmt, ap);
    va_end(ap);
    return code;
}

void vl_status_format(const vl_status *st, char *buf, size_t n)
{
    if (st->file[0] && st->line > 0)
        snprintf(buf, n, "%s:%d: %s", st->file, st->line, st->msg);
    else if (st->file[0])
        snprintf(buf, n, "%s: %s", st->file, st->msg);
    else
        snprintf(buf, n, "%s", st->msg);
}
