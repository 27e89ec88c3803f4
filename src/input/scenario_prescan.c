/* scenario_prescan.c: the checks on the raw text of a scenario before libconfig parses
 * it (scenario_internal.h): binary data, and a lexical pass for what libconfig 1.5
 * would accept but mishandle silently. */
#include <ctype.h>
#include <errno.h>
#include <limits.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"

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

/* Skips a quoted string starting at s (escapes honoured), counting newlines. */
static const char *skip_string(const char *s, int *line)
{
    for (s++; *s && *s != '"'; s++) {
        if (*s == '\\' && s[1])
            s++;
        if (*s == '\n')
            (*line)++;
    }
    return *s ? s + 1 : s;
}

/* Skips a block comment starting at s, counting newlines. */
static const char *skip_block(const char *s, int *line)
{
    for (s += 2; *s && !(s[0] == '*' && s[1] == '/'); s++)
        if (*s == '\n')
            (*line)++;
    return *s ? s + 2 : s;
}

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

/* A numeric token starting at *s: libconfig 1.5 wraps integers beyond 32 bits written
 * without an L suffix without a word, so they are rejected here. Advances *s. */
static int check_number(const char **s, int line, const char *path, vl_status *st)
{
    const char *t = *s;
    int hex, real;
    const char *c = number_end(t, &hex, &real);
    *s = c;
    if (real || c[-1] == 'L')
        return VL_OK;
    errno = 0;
    long long v = strtoll(t, NULL, hex ? 16 : 10);
    if (errno == 0 && v >= INT_MIN && v <= INT_MAX)
        return VL_OK;
    return vl_fail(st, VL_ERR_INPUT, path, line,
                   "integer %.*s does not fit in 32 bits, which the file format would wrap "
                   "silently; write it as a real number (%.*s.0)",
                   (int)(c - t), t, (int)(c - t), t);
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

/* 1 if the file format's grammar allows a string literal after the token prev (its
 * punctuation character, '"' for a string; '\0' at the start) when the innermost open
 * bracket is open ('\0' at the top level): where a value starts, or another string
 * continues one. */
static int string_allowed(char prev, char open)
{
    return prev == '=' || prev == ':' || prev == '(' || prev == '[' || prev == '"' ||
           (prev == ',' && (open == '(' || open == '['));
}

/* The state of the lexical pass. */
typedef struct {
    char *text;
    const char *s;       /* next character */
    int line;
    char prev;           /* last token: punctuation, '"', 'w' word or number */
    size_t depth;        /* brackets open */
    char *open;          /* the open brackets, innermost last */
    int done;            /* the scan stopped at a defused string */
    const char *path;
    vl_status *st;
} scanner;

/* Skips white space or a comment at z->s; 0 if there is none. */
static int skip_blank(scanner *z)
{
    const char *s = z->s;
    unsigned char c = (unsigned char)*s;
    if (c == '\n') {
        z->line++;
        z->s++;
    } else if (isspace(c)) {
        z->s++;
    } else if (c == '#' || (c == '/' && s[1] == '/')) {
        z->s += strcspn(s, "\n");
    } else if (c == '/' && s[1] == '*') {
        z->s = skip_block(s, &z->line);
    } else {
        return 0;
    }
    return 1;
}

/* A string literal; one the grammar does not allow here has its opening quote replaced
 * by '`' and ends the scan (see vl_scenario_prescan). */
static void scan_string(scanner *z)
{
    if (!string_allowed(z->prev, z->depth ? z->open[z->depth - 1] : '\0')) {
        z->text[z->s - z->text] = '`';
        z->done = 1;
        return;
    }
    z->s = skip_string(z->s, &z->line);
    z->prev = '"';
}

/* A punctuation character; brackets are tracked. */
static void scan_punct(scanner *z)
{
    char c = *z->s;
    if (c == '(' || c == '[' || c == '{')
        z->open[z->depth++] = c;
    else if ((c == ')' || c == ']' || c == '}') && z->depth > 0)
        z->depth--;
    z->prev = c;
    z->s++;
}

/* The token (or blank) at z->s. */
static int scan_token(scanner *z)
{
    unsigned char c = (unsigned char)*z->s;
    if (skip_blank(z))
        return VL_OK;
    if (c == '"') {
        scan_string(z);
        return VL_OK;
    }
    if (c == '@')
        return vl_fail(z->st, VL_ERR_INPUT, z->path, z->line,
                       "directives such as @include are not supported: a scenario is one file");
    if (isalpha(c) || c == '*' || c == '_') {
        while (isalnum((unsigned char)*z->s) || *z->s == '_' || *z->s == '*' || *z->s == '-')
            z->s++;
        z->prev = 'w';
        return VL_OK;
    }
    if (starts_number(z->s)) {
        z->prev = 'w';
        return check_number(&z->s, z->line, z->path, z->st);
    }
    scan_punct(z);
    return VL_OK;
}

/* Lexical pass over the text for what libconfig would accept but mishandle silently:
 * oversized integers, and directives (@include: a scenario is one self-contained file).
 * It also defuses a leak of libconfig 1.5: when its parser stops at a string literal
 * that the grammar does not allow there, the string's buffer is lost. Such a string's
 * opening quote is replaced by '`', which starts no token, so the parser stops at the
 * same place with the same "syntax error" and nothing to lose; the scan ends there. */
int vl_scenario_prescan(char *text, const char *path, vl_status *st)
{
    scanner z = {text, text, 1, '\0', 0, malloc(strlen(text) + 1), 0, path, st};
    if (!z.open)
        return vl_fail(st, VL_ERR_INTERNAL, path, 0, "out of memory reading the scenario");
    int rc = VL_OK;
    while (*z.s && !z.done && rc == VL_OK)
        rc = scan_token(&z);
    free(z.open);
    return rc;
}
