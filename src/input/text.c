/* text.c: the text check of the CSV reader (text.h). */
#include "volev/text.h"

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
