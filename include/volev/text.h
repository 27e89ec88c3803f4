/* text.h: whether bytes read from a user's file are text, for the CSV reader (csv.c), so
 * that binary data is refused with a clear message. */
#ifndef VOLEV_TEXT_H
#define VOLEV_TEXT_H

#include <stddef.h>

/* What is wrong with a byte that is not text. */
enum vl_text_fault {
    VL_TEXT_OK,        /* the whole line is text */
    VL_TEXT_NUL,       /* a NUL byte */
    VL_TEXT_CONTROL,   /* a control character other than TAB (CR included), or DEL */
    VL_TEXT_NOT_UTF8   /* not the start of a well-formed UTF-8 sequence */
};

/* Offset of the first byte of the line s[0..len) (its end of line removed) that is not
 * text, or len; *fault receives the reason (VL_TEXT_OK at len). Overlong forms,
 * surrogates and code points above U+10FFFF are ill-formed UTF-8. */
size_t vl_text_scan(const char *s, size_t len, int *fault);

#endif
