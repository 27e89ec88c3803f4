/* text.h: whether bytes read from a user's file are text, for the CSV reader (csv.c), so
 * that binary data is refused with a clear message; and the bounded, escaped excerpt of
 * a user's input that messages quote (every reader's messages). */
#ifndef VOLEV_TEXT_H
#define VOLEV_TEXT_H

#include <stddef.h>
#include <sys/types.h>

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

/* Characters of the input a message quotes at most; a longer input is cut there. */
#define VL_EXCERPT_CHARS 60
/* Room for an excerpt: every character escaped (4 bytes) and the " ... (N bytes)" tail. */
#define VL_EXCERPT_SIZE (4 * VL_EXCERPT_CHARS + 40)

/* The excerpt of s[0..len) that a message may quote, into buf (n > 0 bytes; at least
 * VL_EXCERPT_SIZE for the whole excerpt): at most VL_EXCERPT_CHARS characters, well-formed
 * UTF-8 characters as they are, a control character, DEL, a backslash or a byte that is
 * not UTF-8 text escaped (\n, \t, \r, \\, \xHH), and when cut, "... (N bytes)" after
 * it. Returns buf. */
char *vl_text_excerpt(const char *s, size_t len, char *buf, size_t n);
/* The same for a NUL-terminated string. */
char *vl_text_excerpt_str(const char *s, char *buf, size_t n);

/* What a file of mode m that is not a regular file is ("a folder", "a character
 * device", ...), for messages refusing it. */
const char *vl_text_file_kind(mode_t m);

#endif
