/* text.c: the text check of the CSV reader and the excerpts of input that messages quote
 * (text.h). */
#include "volev/text.h"

#include <stdio.h>
#include <string.h>
#include <sys/stat.h>

/* Length of the well-formed UTF-8 sequence at s (n >= 1 bytes left), 0 if there is none
 * (Unicode 15, table 3-7: overlong forms, surrogates and code points above U+10FFFF are
 * ill-formed). */
static size_t utf8_len(const unsigned char *s, size_t n)
{
    unsigned char c = s[0], lo = 0x80, hi = 0xBF;
    size_t k;
    if (c < 0x80)
        return 1;
    if (c >= 0xC2 && c <= 0xDF)
        k = 2;
    else if (c == 0xE0)
        k = 3, lo = 0xA0;
    else if ((c >= 0xE1 && c <= 0xEC) || c == 0xEE || c == 0xEF)
        k = 3;
    else if (c == 0xED)
        k = 3, hi = 0x9F;
    else if (c == 0xF0)
        k = 4, lo = 0x90;
    else if (c >= 0xF1 && c <= 0xF3)
        k = 4;
    else if (c == 0xF4)
        k = 4, hi = 0x8F;
    else
        return 0;
    if (n < k || s[1] < lo || s[1] > hi)
        return 0;
    for (size_t j = 2; j < k; j++)
        if (s[j] < 0x80 || s[j] > 0xBF)
            return 0;
    return k;
}

size_t vl_text_scan(const char *s, size_t len, int *fault)
{
    const unsigned char *u = (const unsigned char *)s;
    for (size_t i = 0; i < len;) {
        unsigned char c = u[i];
        size_t k;
        if (c == 0)
            *fault = VL_TEXT_NUL;
        else if ((c < 0x20 && c != '\t') || c == 0x7F)
            *fault = VL_TEXT_CONTROL;
        else if ((k = utf8_len(u + i, len - i)) == 0)
            *fault = VL_TEXT_NOT_UTF8;
        else {
            i += k;
            continue;
        }
        return i;
    }
    *fault = VL_TEXT_OK;
    return len;
}

/* Appends the escaped form of the byte or character at u[0..k) to buf at *used, if it
 * fits in the n bytes of buf with its terminator; 0 if it does not. */
static int put_escaped(const unsigned char *u, size_t k, char *buf, size_t n, size_t *used)
{
    char tmp[8];
    size_t m;
    if (k > 1) {
        memcpy(tmp, u, k);
        m = k;
    } else if (u[0] == '\n' || u[0] == '\t' || u[0] == '\r' || u[0] == '\\') {
        tmp[0] = '\\';
        tmp[1] = u[0] == '\n' ? 'n' : u[0] == '\t' ? 't' : u[0] == '\r' ? 'r' : '\\';
        m = 2;
    } else if (u[0] < 0x20 || u[0] >= 0x7F) {
        snprintf(tmp, sizeof tmp, "\\x%02X", u[0]);
        m = 4;
    } else {
        tmp[0] = (char)u[0];
        m = 1;
    }
    if (*used + m >= n)
        return 0;
    memcpy(buf + *used, tmp, m);
    *used += m;
    return 1;
}

char *vl_text_excerpt(const char *s, size_t len, char *buf, size_t n)
{
    const unsigned char *u = (const unsigned char *)s;
    size_t used = 0, i = 0, chars = 0;
    buf[0] = '\0';
    if (n == 0)
        return buf;
    while (i < len && chars < VL_EXCERPT_CHARS) {
        size_t k = u[i] >= 0x80 ? utf8_len(u + i, len - i) : 1;
        if (!put_escaped(u + i, k ? k : 1, buf, n, &used))
            break;
        i += k ? k : 1;
        chars++;
    }
    buf[used] = '\0';
    if (i < len) {
        char tail[40];
        int m = snprintf(tail, sizeof tail, "... (%zu bytes)", len);
        if (used + (size_t)m < n)
            memcpy(buf + used, tail, (size_t)m + 1);
    }
    return buf;
}

char *vl_text_excerpt_str(const char *s, char *buf, size_t n)
{
    return vl_text_excerpt(s, strlen(s), buf, n);
}

/* What a file that is not a regular file is. */
const char *vl_text_file_kind(mode_t m)
{
    if (S_ISDIR(m))
        return "a folder";
    if (S_ISCHR(m))
        return "a character device";
    if (S_ISBLK(m))
        return "a block device";
    if (S_ISFIFO(m))
        return "a FIFO (named pipe)";
    if (S_ISSOCK(m))
        return "a socket";
    return "not a regular file";
}
