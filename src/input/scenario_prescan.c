/* scenario_prescan.c: the checks on the raw text of a scenario before libconfig parses
 * it (scenario_internal.h): binary data, and a lexical pass for what libconfig 1.5 would
 * refuse with a vague message ("syntax error" at the end of the file, "memory exhausted")
 * or accept but mishandle silently (integers wrapped to 32 bits, 1e-400 read as 0, a
 * group of 20000 settings checked for repeats in quadratic time). The structure it sees
 * (brackets, names, limits) is kept by scenario_names.c. */
#include <ctype.h>
#include <errno.h>
#include <limits.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"
#include "volev/number.h"
#include "volev/text.h"

int vl_scenario_check_bytes(const char *text, size_t len, const char *path, vl_status *st)
{
    int line = 1;
    for (size_t i = 0; i < len; i++) {
        unsigned char c = (unsigned char)text[i];
        if (c == '\n')
            line += line < INT_MAX;
        else if (c == 0)
            return vl_fail(st, VL_ERR_INPUT, path, line,
                           "the scenario contains a NUL byte (binary data, not a text file)");
        else if ((c < 0x20 && !isspace(c)) || c == 0x7F)
            return vl_fail(st, VL_ERR_INPUT, path, line,
                           "binary data, not a text file: control character 0x%02X", c);
    }
    return VL_OK;
}

/* The state of the lexical pass. */
typedef struct scanner {
    const char *text, *s;      /* the text (NUL-terminated) and the next character */
    int line;
    char prev;                 /* last token: punctuation, '"' string, 'w' word, 'n' number */
    const char *word;          /* the last word and its length and line: a setting's name */
    size_t word_len;           /*   when '=' or ':' follows it */
    size_t tokens;             /* tokens seen: none means an empty scenario */
    int done;                  /* the scan stopped at a defused string */
    vl_names names;
    char *out;                 /* the text for libconfig, built as far as copied */
    size_t out_len, out_cap;
    const char *copied;        /* text before this is in out */
    const char *path;
    vl_status *st;
} scanner;

/* ------------------------------------------------------------------ the output */

/* Appends n bytes to the output. */
static int put(scanner *z, const char *b, size_t n)
{
    if (z->out_len + n + 1 > z->out_cap) {
        size_t cap = 2 * z->out_cap + n + 1;
        char *o = realloc(z->out, cap);
        if (!o)
            return vl_fail(z->st, VL_ERR_INTERNAL, z->path, 0, "out of memory reading the scenario");
        z->out = o;
        z->out_cap = cap;
    }
    memcpy(z->out + z->out_len, b, n);
    z->out_len += n;
    z->out[z->out_len] = '\0';
    return VL_OK;
}

/* One change of the text for libconfig: the del bytes at `at` replaced by ins. */
static int edit(scanner *z, const char *at, size_t del, const char *ins)
{
    int rc = put(z, z->copied, (size_t)(at - z->copied));
    if (!rc)
        rc = put(z, ins, strlen(ins));
    z->copied = at + del;
    return rc;
}

/* ------------------------------------------------------------------ skipping */

/* Skips a quoted string starting at z->s (escapes honoured), counting newlines; one
 * that never ends is refused at the line of its opening quote. */
static int skip_string(scanner *z)
{
    int start = z->line;
    const char *s = z->s;
    for (s++; *s && *s != '"'; s++) {
        if (*s == '\\' && s[1])
            s++;
        if (*s == '\n')
            z->line += z->line < INT_MAX;
    }
    if (!*s)
        return vl_fail(z->st, VL_ERR_INPUT, z->path, start,
                       "unterminated string: the '\"' on this line is never closed");
    z->s = s + 1;
    return VL_OK;
}

/* Skips a block comment starting at z->s, counting newlines; one that never ends is
 * refused at the line where it starts. */
static int skip_block(scanner *z)
{
    int start = z->line;
    const char *s = z->s;
    for (s += 2; *s && !(s[0] == '*' && s[1] == '/'); s++)
        if (*s == '\n')
            z->line += z->line < INT_MAX;
    if (!*s)
        return vl_fail(z->st, VL_ERR_INPUT, z->path, start,
                       "unterminated comment: the '/*' on this line is never closed");
    z->s = s + 2;
    return VL_OK;
}

/* Skips white space or a comment at z->s; *skipped: 0 if there is none. */
static int skip_blank(scanner *z, int *skipped)
{
    const char *s = z->s;
    unsigned char c = (unsigned char)*s;
    *skipped = 1;
    if (c == '\n') {
        z->line += z->line < INT_MAX;
        z->s++;
    } else if (isspace(c)) {
        z->s++;
    } else if (c == '#' || (c == '/' && s[1] == '/')) {
        z->s += strcspn(s, "\n");
    } else if (c == '/' && s[1] == '*') {
        return skip_block(z);
    } else {
        *skipped = 0;
    }
    return VL_OK;
}

/* ------------------------------------------------------------------ numbers */

/* 1 if c continues a numeric token (a sign only right after a decimal exponent). */
static int number_char(const char *c, int hex)
{
    if (isalnum((unsigned char)*c) || *c == '.')
        return 1;
    return (*c == '+' || *c == '-') && !hex && (c[-1] == 'e' || c[-1] == 'E');
}

/* End of the numeric token at t; *hex: written in hexadecimal; *real: it has a decimal
 * point or exponent. */
static const char *number_end(const char *t, int *hex, int *real)
{
    const char *c = t + (*t == '+' || *t == '-');
    *hex = c[0] == '0' && (c[1] == 'x' || c[1] == 'X');
    *real = 0;
    for (; number_char(c, *hex); c++)
        *real |= *c == '.' || (!*hex && (*c == 'e' || *c == 'E'));
    return c;
}

/* 1 if a numeric token starts at s. */
static int starts_number(const char *s)
{
    unsigned char c = (unsigned char)s[0];
    if (isdigit(c))
        return 1;
    if ((c == '-' || c == '+' || c == '.') && isdigit((unsigned char)s[1]))
        return 1;
    return (c == '-' || c == '+') && s[1] == '.' && isdigit((unsigned char)s[2]);
}

/* t[0..len) as a whole number if it fits in 64 bits; 0 if it does not. */
static int fits_64(const char *t, size_t len, long long *v)
{
    char buf[32];
    if (len >= sizeof buf)
        return 0; /* more than 31 characters: beyond 64 bits, or zeros we need not honour */
    memcpy(buf, t, len);
    buf[len] = '\0';
    errno = 0;
    char *end;
    *v = strtoll(buf, &end, 10);
    return errno == 0 && *end == '\0';
}

/* An integer beyond 64 bits, value of the setting key (NULL: not a setting's value). A
 * real row reads it as the real number it is; anything else is refused. */
static int huge_integer(scanner *z, const char *t, size_t digits, size_t suffix,
                        const char *key)
{
    char shown[VL_EXCERPT_SIZE];
    long row = key ? vl_scenario_find_key(key) : -1;
    const vl_param *p = row >= 0 ? vl_scenario_param_key((size_t)row, NULL, 0) : NULL;
    if (p && p->type == VL_PT_REAL)
        return edit(z, t + digits, suffix, ".0");
    vl_text_excerpt(t, digits, shown, sizeof shown);
    if (p && p->type == VL_PT_INT)
        return vl_fail(z->st, VL_ERR_INPUT, z->path, z->line,
                       "%s = %s is out of bounds [%.0f, %.0f]", key, shown, p->lo, p->hi);
    return vl_fail(z->st, VL_ERR_INPUT, z->path, z->line,
                   "integer %s does not fit in 64 bits; write it as a real number (%s.0)", shown,
                   shown);
}

/* A whole number t[0..c) (an L suffix included), value of the setting key (NULL: not a
 * setting's value). libconfig 1.5 wraps integers beyond 32 bits written without the L
 * suffix to 32 bits without a word, and saturates those beyond 64 bits: a setting's value
 * beyond 32 bits is given the suffix; elsewhere (in a list or array, whose elements must
 * share one type) it is refused. */
static int check_integer(scanner *z, const char *t, const char *c, const char *key)
{
    char shown[VL_EXCERPT_SIZE];
    size_t suffix = 0;
    while (c - suffix > t && c[-1 - (long)suffix] == 'L')
        suffix++;
    size_t digits = (size_t)(c - t) - suffix;
    long long v;
    if (!fits_64(t, digits, &v))
        return huge_integer(z, t, digits, suffix, key);
    if (suffix || (v >= INT_MIN && v <= INT_MAX))
        return VL_OK;
    if (key)
        return edit(z, c, 0, "L");
    vl_text_excerpt(t, digits, shown, sizeof shown);
    return vl_fail(z->st, VL_ERR_INPUT, z->path, z->line,
                   "integer %s does not fit in 32 bits, which the file format would wrap "
                   "silently; write it as a real number (%s.0)", shown, shown);
}

/* The numeric token at z->s, value of the setting key (NULL: not a setting's value):
 * hexadecimal is refused, a real that underflows too, an integer checked as above. A
 * token that is no number at all is left to libconfig's syntax error. */
static int check_number(scanner *z, const char *key)
{
    char shown[VL_EXCERPT_SIZE];
    const char *t = z->s;
    int hex, real, kind = VL_NUMBER_OK;
    const char *c = number_end(t, &hex, &real);
    double v;
    z->s = c;
    if (hex)
        kind = VL_NUMBER_HEX;
    else if (!real)
        return check_integer(z, t, c, key);
    else if (vl_number_parse(t, (size_t)(c - t), &v) == VL_NUMBER_UNDERFLOW)
        kind = VL_NUMBER_UNDERFLOW;
    if (kind == VL_NUMBER_OK)
        return VL_OK;
    return vl_fail(z->st, VL_ERR_INPUT, z->path, z->line, "%s%s%s %s", key ? key : "",
                   key ? " = " : "", vl_text_excerpt(t, (size_t)(c - t), shown, sizeof shown),
                   vl_number_why(kind));
}

/* ------------------------------------------------------------------ tokens */

/* 1 if the file format's grammar allows a string literal after the token prev (its
 * punctuation character, '"' for a string; '\0' at the start) when the innermost open
 * bracket is open ('\0' at the top level): where a value starts, or another string
 * continues one. */
static int string_allowed(char prev, char open)
{
    return prev == '=' || prev == ':' || prev == '(' || prev == '[' || prev == '"' ||
           (prev == ',' && (open == '(' || open == '['));
}

/* A string literal; one the grammar does not allow here has its opening quote replaced
 * by '`' and ends the scan (see vl_scenario_prescan). */
static int scan_string(scanner *z)
{
    if (!string_allowed(z->prev, z->names.scope[z->names.depth].open)) {
        z->done = 1;
        return edit(z, z->s, 1, "`");
    }
    z->prev = '"';
    return skip_string(z);
}

/* A punctuation character: '=' or ':' after a word names a setting; brackets open and
 * close scopes. */
static int scan_punct(scanner *z)
{
    char c = *z->s, prev = z->prev;
    int line = z->line, rc = VL_OK;
    z->prev = c;
    z->s++;
    if ((c == '=' || c == ':') && prev == 'w' && !vl_names_in_list(&z->names))
        rc = vl_names_setting(&z->names, z->word, z->word_len, line);
    else if (c == '(' || c == '[' || c == '{')
        rc = vl_names_open(&z->names, c, line, prev == '=' || prev == ':');
    else if (c == ')' || c == ']' || c == '}')
        rc = vl_names_close(&z->names, c, line);
    return rc;
}

/* 1 if the token at z->s starts a value that is an element of the innermost list or
 * array. */
static int starts_element(const scanner *z)
{
    char c = *z->s;
    if (!vl_names_in_list(&z->names) || !(z->prev == '(' || z->prev == '[' || z->prev == ','))
        return 0;
    return c == '"' || c == '{' || c == '(' || c == '[' || isalpha((unsigned char)c) ||
           starts_number(z->s);
}

/* The token (or blank) at z->s. */
static int scan_token(scanner *z)
{
    unsigned char c = (unsigned char)*z->s;
    int skipped, rc = skip_blank(z, &skipped);
    if (rc || skipped)
        return rc;
    z->tokens++;
    if (starts_element(z) && (rc = vl_names_element(&z->names, z->line)))
        return rc;
    if (c == '"')
        return scan_string(z);
    if (c == '@')
        return vl_fail(z->st, VL_ERR_INPUT, z->path, z->line,
                       "directives such as @include are not supported: a scenario is one file");
    if (isalpha(c) || c == '*' || c == '_') {
        z->word = z->s;
        while (isalnum((unsigned char)*z->s) || *z->s == '_' || *z->s == '*' || *z->s == '-')
            z->s++;
        z->word_len = (size_t)(z->s - z->word);
        z->prev = 'w';
        return VL_OK;
    }
    if (starts_number(z->s)) {
        const char *key = z->prev == '=' || z->prev == ':' ? z->names.setting : NULL;
        z->prev = 'n'; /* a number names no setting */
        return check_number(z, key);
    }
    return scan_punct(z);
}

/* ------------------------------------------------------------------ the pass */

/* The end of the text: nothing in it, or a bracket left open. */
static int check_end(scanner *z)
{
    if (z->tokens == 0)
        return vl_fail(z->st, VL_ERR_INPUT, z->path, 0,
                       "the scenario is empty (only blanks and comments): a scenario sets at "
                       "least one parameter");
    return vl_names_end(&z->names);
}

/* Lexical pass over the text (scenario_internal.h). It also defuses a leak of libconfig
 * 1.5: when its parser stops at a string literal that the grammar does not allow there,
 * the string's buffer is lost. Such a string's opening quote is replaced by '`', which
 * starts no token, so the parser stops at the same place with the same "syntax error" and
 * nothing to lose; the scan ends there. */
char *vl_scenario_prescan(const char *text, size_t len, const char *path, vl_status *st)
{
    scanner z;
    memset(&z, 0, sizeof z);
    z.text = z.s = z.copied = text;
    z.line = 1;
    z.path = path;
    z.st = st;
    vl_names_init(&z.names, path, st);
    int rc = put(&z, "", 0);
    while (rc == VL_OK && *z.s && !z.done)
        rc = scan_token(&z);
    if (rc == VL_OK && !z.done)
        rc = check_end(&z);
    if (rc == VL_OK)
        rc = put(&z, z.copied, len - (size_t)(z.copied - text));
    vl_names_free(&z.names);
    if (rc) {
        free(z.out);
        return NULL;
    }
    return z.out;
}
