/* number.c: decimal numbers written by a user (number.h). strtod alone would accept
 * hexadecimal, "nan", leading spaces, and turn 1e-400 into 0 without a word. */
#include "volev/number.h"

#include <float.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

/* Largest text converted on the stack; a longer number is copied to the heap. */
#define NUMBER_STACK 128

/* Length of the decimal number at the start of s[0..len) by the grammar of number.h, 0 if
 * there is none; *nonzero: a mantissa digit other than 0. */
static size_t decimal_length(const char *s, size_t len, int *nonzero)
{
    size_t i = 0, digits = 0;
    *nonzero = 0;
    if (i < len && (s[i] == '+' || s[i] == '-'))
        i++;
    for (; i < len && s[i] >= '0' && s[i] <= '9'; i++, digits++)
        *nonzero |= s[i] != '0';
    if (i < len && s[i] == '.')
        for (i++; i < len && s[i] >= '0' && s[i] <= '9'; i++, digits++)
            *nonzero |= s[i] != '0';
    if (digits == 0)
        return 0;
    if (i < len && (s[i] == 'e' || s[i] == 'E')) {
        size_t j = i + 1, exp_digits = 0;
        if (j < len && (s[j] == '+' || s[j] == '-'))
            j++;
        for (; j < len && s[j] >= '0' && s[j] <= '9'; j++)
            exp_digits++;
        if (exp_digits == 0)
            return 0;
        i = j;
    }
    return i;
}

/* 1 if s[0..len) is "0x" or "0X" after an optional sign. */
static int is_hex(const char *s, size_t len)
{
    size_t i = len > 0 && (s[0] == '+' || s[0] == '-');
    return i + 1 < len && s[i] == '0' && (s[i + 1] == 'x' || s[i + 1] == 'X');
}

/* 1 if s[0..len) is nan, inf or infinity after an optional sign (any case); *v its value. */
static int is_word(const char *s, size_t len, double *v)
{
    size_t i = len > 0 && (s[0] == '+' || s[0] == '-');
    const char *w = s + i;
    size_t n = len - i;
    double sign = s[0] == '-' ? -1.0 : 1.0;
    if (n == 3 && strncasecmp(w, "nan", 3) == 0)
        *v = sign * NAN;
    else if ((n == 3 && strncasecmp(w, "inf", 3) == 0) ||
             (n == 8 && strncasecmp(w, "infinity", 8) == 0))
        *v = sign * INFINITY;
    else
        return 0;
    return 1;
}

int vl_number_parse(const char *s, size_t len, double *v)
{
    int nonzero;
    *v = 0.0;
    if (is_hex(s, len))
        return VL_NUMBER_HEX;
    if (is_word(s, len, v))
        return VL_NUMBER_WORD;
    if (len == 0 || decimal_length(s, len, &nonzero) != len)
        return VL_NUMBER_SYNTAX;
    char small[NUMBER_STACK], *text = len < sizeof small ? small : malloc(len + 1);
    if (!text)
        return VL_NUMBER_OVERFLOW; /* out of memory: a number this long is absurd anyway */
    memcpy(text, s, len);
    text[len] = '\0';
    *v = strtod(text, NULL);
    if (text != small)
        free(text);
    if (isinf(*v))
        return VL_NUMBER_OVERFLOW;
    if (nonzero && fabs(*v) < DBL_MIN) /* 0 or subnormal: digits lost */
        return VL_NUMBER_UNDERFLOW;
    return VL_NUMBER_OK;
}

int vl_number_parse_str(const char *s, double *v) { return vl_number_parse(s, strlen(s), v); }

const char *vl_number_why(int kind)
{
    switch (kind) {
    case VL_NUMBER_OK: return "";
    case VL_NUMBER_HEX: return "is not a number (hexadecimal is not accepted: write it in decimal)";
    case VL_NUMBER_WORD: return "is not a finite number";
    case VL_NUMBER_OVERFLOW: return "is not a finite number (beyond the range of a double, 1.8e308)";
    case VL_NUMBER_UNDERFLOW:
        return "underflows (not zero, but below the smallest normal double, 2.2e-308; write 0 "
               "if zero is meant)";
    default: return "is not a number";
    }
}
