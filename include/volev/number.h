/* number.h: the one reader of decimal numbers written by a user, shared by every reader
 * of numbers (the scenario's pre-scan, --set, star tracks, catalogues), so that they all
 * accept and refuse the same texts for the same reasons. */
#ifndef VOLEV_NUMBER_H
#define VOLEV_NUMBER_H

#include <stddef.h>

/* What a text is as a number. */
enum vl_number_kind {
    VL_NUMBER_OK,        /* a finite decimal number */
    VL_NUMBER_SYNTAX,    /* not a decimal number at all (empty, trailing text, spaces) */
    VL_NUMBER_HEX,       /* hexadecimal (0x10, 0x1p0): not accepted */
    VL_NUMBER_WORD,      /* nan, inf, infinity (any case, signed): *v is NaN or +-inf */
    VL_NUMBER_OVERFLOW,  /* beyond the double range: *v is +-inf */
    VL_NUMBER_UNDERFLOW  /* not zero, but below the smallest normal double (DBL_MIN,
                            2.2e-308): it would silently become 0 or lose digits */
};

/* Reads s[0..len) as a whole decimal number: an optional sign, digits with at most one
 * decimal point (at least one digit), an optional exponent (e or E, optional sign,
 * digits); nothing before or after. *v receives the value (see the kinds). */
int vl_number_parse(const char *s, size_t len, double *v);
/* The same for a NUL-terminated string. */
int vl_number_parse_str(const char *s, double *v);
/* Why a text of this kind is not accepted, for messages ("is not a number",
 * "is hexadecimal ..."); "" for VL_NUMBER_OK. */
const char *vl_number_why(int kind);

#endif
