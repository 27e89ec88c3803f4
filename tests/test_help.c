/* test_help.c: the help of the volev program against its parsers, the man page and the
 * README. The command list and each command's options are read from the program's own
 * help (printed from src/cli/help_table.c); every listed option is then given to the
 * command's parser, which must know it, and looked up in docs/volev.1 (the command's
 * subsection of OPTIONS) and README.md (each synopsis as a line of its own), so that none of them can drift
 * from the others. Options outside the table are refused before any parser sees them
 * (vl_cli_check_options), which the test checks too. */
#define _GNU_SOURCE
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"

enum { MAX_COMMANDS = 32, MAX_OPTIONS = 32, MAX_SYNOPSES = 4 };

static char tmpdir[256];

typedef struct {
    char spellings[2][32];
    int nspellings;
    int takes_value;
} option;

typedef struct {
    char name[32];
    char synopses[MAX_SYNOPSES][160];
    int nsynopses;
    option options[MAX_OPTIONS];
    int noptions;
} command;

/* Runs "volev ARGS" in tmpdir; the exit code; stdout and stderr into *out and *err
 * (malloc'd; NULL pointers: not wanted). */
static int volev(const char *args, char **out, char **err)
{
    int rc = vl_test_sh(tmpdir, "'%s' %s", vl_test_bin(), args);
    if (out)
        *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    if (err)
        *err = vl_test_slurp(tmpdir, "err.txt", NULL);
    return rc;
}

/* The text from the line that starts with from up to the next line that starts with
 * any of ends (or the end), malloc'd; NULL if no line starts with from. */
static char *section(const char *text, const char *from, const char *const *ends)
{
    const char *p = text;
    size_t nf = strlen(from);
    while (p && strncmp(p, from, nf) != 0) {
        p = strchr(p, '\n');
        p = p ? p + 1 : NULL;
    }
    if (!p)
        return NULL;
    const char *q = strchr(p, '\n');
    q = q ? q + 1 : p + strlen(p);
    for (; *q; q = strchr(q, '\n') ? strchr(q, '\n') + 1 : q + strlen(q)) {
        int stop = 0;
        for (int k = 0; ends[k]; k++)
            stop |= strncmp(q, ends[k], strlen(ends[k])) == 0;
        if (stop)
            break;
    }
    return strndup(p, (size_t)(q - p));
}

/* The man page's source with the escapes of hyphens and fonts removed. */
static char *man_text(void)
{
    char *src = vl_test_slurp(vl_test_top(), "docs/volev.1", NULL);
    ck_assert_msg(src != NULL, "cannot read docs/volev.1");
    char *w = src;
    for (const char *r = src; *r; r++) {
        if (r[0] == '\\' && r[1] == '-')
            continue;
        if (r[0] == '\\' && r[1] == 'f' && r[2]) {
            r += 2;
            continue;
        }
        *w++ = *r;
    }
    *w = '\0';
    return src;
}

/* The commands of the overview ("  volev NAME ..." lines; the --help | --version line
 * is not a command): names and synopses, in order. */
static int read_overview(const char *text, command *cmds)
{
    int n = 0;
    for (const char *p = text; p; p = strchr(p, '\n') ? strchr(p, '\n') + 1 : NULL) {
        if (strncmp(p, "  volev ", 8) != 0 || strncmp(p + 8, "--", 2) == 0)
            continue;
        const char *syn = p + 8;
        size_t len = strcspn(syn, "\n"), name_len = strcspn(syn, " \n");
        ck_assert(name_len < sizeof cmds[0].name && len < sizeof cmds[0].synopses[0]);
        if (n == 0 || strncmp(cmds[n - 1].name, syn, name_len) != 0 ||
            cmds[n - 1].name[name_len] != '\0') {
            ck_assert_int_lt(n, MAX_COMMANDS);
            memset(&cmds[n], 0, sizeof cmds[n]);
            memcpy(cmds[n++].name, syn, name_len);
        }
        command *c = &cmds[n - 1];
        ck_assert_int_lt(c->nsynopses, MAX_SYNOPSES);
        memcpy(c->synopses[c->nsynopses++], syn, len);
    }
    return n;
}

/* One option line "  -o, --output DIR   meaning" into o. */
static void read_option(const char *line, option *o)
{
    memset(o, 0, sizeof *o);
    const char *end = strstr(line + 2, "  ");
    const char *eol = strchr(line, '\n');
    if (!end || (eol && end > eol))
        end = eol ? eol : line + strlen(line);
    char head[128];
    ck_assert((size_t)(end - line - 2) < sizeof head);
    snprintf(head, sizeof head, "%.*s", (int)(end - line - 2), line + 2);
    char *save = NULL;
    for (char *tok = strtok_r(head, ", ", &save); tok; tok = strtok_r(NULL, ", ", &save)) {
        if (tok[0] == '-') {
            ck_assert_int_lt(o->nspellings, 2);
            snprintf(o->spellings[o->nspellings++], sizeof o->spellings[0], "%s", tok);
        } else {
            o->takes_value = 1;
        }
    }
    ck_assert_msg(o->nspellings > 0, "option line without an option: %s", line);
}

/* The options listed in one command's help. */
static void read_options(const char *help, command *c)
{
    static const char *const ends[] = {"examples:", NULL};
    char *opts = section(help, "options:", ends);
    ck_assert_msg(opts != NULL, "%s: no options: section in\n%s", c->name, help);
    for (const char *p = opts; p; p = strchr(p, '\n') ? strchr(p, '\n') + 1 : NULL)
        if (strncmp(p, "  -", 3) == 0) {
            ck_assert_int_lt(c->noptions, MAX_OPTIONS);
            read_option(p, &c->options[c->noptions++]);
        }
    free(opts);
}

static int is_help_option(const option *o) { return strcmp(o->spellings[0], "-h") == 0; }

/* Whether word is a whole token of one of c's synopses (tokens split at blanks, [ ] |). */
static int in_synopses(const command *c, const char *word)
{
    for (int s = 0; s < c->nsynopses; s++) {
        char buf[160], *save = NULL;
        snprintf(buf, sizeof buf, "%s", c->synopses[s]);
        for (char *t = strtok_r(buf, " []|", &save); t; t = strtok_r(NULL, " []|", &save))
            if (strcmp(t, word) == 0)
                return 1;
    }
    return 0;
}

static const option *find_option(const command *c, const char *s)
{
    for (int k = 0; k < c->noptions; k++)
        for (int j = 0; j < c->options[k].nspellings; j++)
            if (strcmp(c->options[k].spellings[j], s) == 0)
                return &c->options[k];
    return NULL;
}

/* Every example runs this command with listed options only. */
static void check_examples(const command *c, const char *help)
{
    static const char *const ends[] = {"See ", NULL};
    char *ex = section(help, "examples:", ends);
    ck_assert_msg(ex != NULL, "%s: no examples: section", c->name);
    char call[48];
    snprintf(call, sizeof call, "volev %.31s", c->name);
    int examples = 0;
    for (char *line = strtok(ex, "\n"); line; line = strtok(NULL, "\n")) {
        char *at = strstr(line, call);
        if (strncmp(line, "  ", 2) != 0 || strstr(line, "# ") || !at)
            continue;
        examples++;
        char shown[256], *save = NULL;
        snprintf(shown, sizeof shown, "%s", line + 2);
        for (char *t = strtok_r(at + strlen(call), " ", &save); t; t = strtok_r(NULL, " ", &save)) {
            if (strcmp(t, "|") == 0)
                break;
            if (t[0] == '-' && t[1] != '\0')
                ck_assert_msg(find_option(c, t), "%s: example '%s' uses '%s', not in its options",
                              c->name, shown, t);
        }
    }
    ck_assert_msg(examples > 0, "%s: no example of '%s'", c->name, call);
    free(ex);
}

/* The same help from `volev help NAME`, `volev NAME --help`, `volev NAME -h` and with
 * the help option after other arguments; returned (malloc'd). */
static char *help_of(const command *c)
{
    char args[128], *out, *err, *again;
    snprintf(args, sizeof args, "help %.31s", c->name);
    ck_assert_int_eq(volev(args, &out, &err), 0);
    ck_assert_msg(err[0] == '\0', "%s: stderr: %s", args, err);
    free(err);
    const char *forms[] = {"%s --help", "%s -h", "%s no-such-file.cfg --help"};
    for (size_t k = 0; k < sizeof forms / sizeof *forms; k++) {
        snprintf(args, sizeof args, forms[k], c->name);
        ck_assert_int_eq(volev(args, &again, NULL), 0);
        ck_assert_msg(strcmp(out, again) == 0, "'volev %s' differs from 'volev help %s'", args,
                      c->name);
        free(again);
    }
    return out;
}

/* The help's usage lines are the overview's synopses. */
static void check_usage(const command *c, const char *help)
{
    for (int s = 0; s < c->nsynopses; s++) {
        char want[200];
        snprintf(want, sizeof want, "%s volev %s\n", s ? "   or:" : "usage:", c->synopses[s]);
        ck_assert_msg(strstr(help, want), "%s: help lacks '%s'", c->name, want);
    }
}

/* Each listed option reaches the command's parser, which knows it: with no other
 * argument the parser stops at a missing argument (or lists, for plot --list), never at
 * an unknown option; an option outside the list is refused. */
static void check_parser(const command *c)
{
    for (int k = 0; k < c->noptions; k++) {
        const option *o = &c->options[k];
        if (is_help_option(o))
            continue;
        for (int j = 0; j < o->nspellings; j++) {
            char args[128], *err;
            snprintf(args, sizeof args, "%.31s %.31s%.31s", c->name, o->spellings[j],
                     o->takes_value ? " x=1" : "");
            int rc = volev(args, NULL, &err);
            ck_assert_msg((rc == 0 || rc == 2) && !strstr(err, "unknown option"),
                          "volev %s: exit %d, parser does not know the option: %s", args, rc,
                          err);
            free(err);
        }
    }
    char args[128], *err;
    snprintf(args, sizeof args, "%.31s --no-such-option", c->name);
    ck_assert_int_eq(volev(args, NULL, &err), 2);
    ck_assert_msg(strstr(err, "unknown option '--no-such-option'"), "volev %s: %s", args, err);
    free(err);
}

/* The command in the man page: in SYNOPSIS, and each option in its own subsection
 * ".SS NAME" of OPTIONS; and every synopsis, as printed, in README.md. */
static void check_docs(const command *c, const char *man, const char *readme)
{
    static const char *const sh[] = {".SH", NULL}, *const ss[] = {".SS", ".SH", NULL};
    char *syn = section(man, ".SH SYNOPSIS", sh);
    char *opts = section(man, ".SH OPTIONS", sh);
    ck_assert_msg(syn && opts, "docs/volev.1 lacks SYNOPSIS or OPTIONS");
    char want[200];
    snprintf(want, sizeof want, ".B volev %.31s\n", c->name);
    char want_args[200];
    snprintf(want_args, sizeof want_args, ".B volev %.31s ", c->name);
    ck_assert_msg(strstr(syn, want) || strstr(syn, want_args),
                  "docs/volev.1 SYNOPSIS lacks 'volev %s'", c->name);
    snprintf(want, sizeof want, ".SS %.31s", c->name);
    char *sub = section(opts, want, ss);
    ck_assert_msg(sub, "docs/volev.1 OPTIONS lacks the subsection '.SS %s'", c->name);
    for (int k = 0; k < c->noptions; k++)
        for (int j = 0; j < c->options[k].nspellings; j++)
            ck_assert_msg(strstr(sub, c->options[k].spellings[j]),
                          "docs/volev.1, OPTIONS of %s, lacks %s", c->name,
                          c->options[k].spellings[j]);
    for (int s = 0; s < c->nsynopses; s++) {
        snprintf(want, sizeof want, "\nvolev %s\n", c->synopses[s]);
        ck_assert_msg(strstr(readme, want), "README.md lacks the line 'volev %s'", c->synopses[s]);
    }
    free(sub);
    free(syn);
    free(opts);
}

START_TEST(every_command_documented)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-help");
    char *overview, *other;
    ck_assert_int_eq(volev("help", &overview, NULL), 0);
    ck_assert_int_eq(volev("--help", &other, NULL), 0);
    ck_assert_str_eq(overview, other);
    free(other);
    ck_assert_int_eq(volev("-h", &other, NULL), 0);
    ck_assert_str_eq(overview, other);
    free(other);
    static command cmds[MAX_COMMANDS];
    int n = read_overview(overview, cmds);
    /* the commands the program had when this test was written: none may disappear */
    const char *known[] = {"run", "validate", "balance", "sweep", "plot",
                           "compare", "processes", "columns", "help"};
    for (size_t k = 0; k < sizeof known / sizeof *known; k++) {
        int found = 0;
        for (int i = 0; i < n; i++)
            found |= strcmp(cmds[i].name, known[k]) == 0;
        ck_assert_msg(found, "the overview lacks '%s':\n%s", known[k], overview);
    }
    char *man = man_text(), *readme = vl_test_slurp(vl_test_top(), "README.md", NULL);
    ck_assert_ptr_nonnull(readme);
    for (int i = 0; i < n; i++) {
        command *c = &cmds[i];
        char *help = help_of(c);
        check_usage(c, help);
        read_options(help, c);
        ck_assert_msg(c->noptions > 0 && is_help_option(&c->options[c->noptions - 1]),
                      "%s: -h, --help not listed last", c->name);
        for (int k = 0; k + 1 < c->noptions; k++) {
            int shown = 0;
            for (int j = 0; j < c->options[k].nspellings; j++)
                shown |= in_synopses(c, c->options[k].spellings[j]);
            ck_assert_msg(shown, "%s: option %s is not in the synopsis", c->name,
                          c->options[k].spellings[0]);
        }
        c->noptions--; /* -h, --help: common to all, documented once in the man page */
        check_examples(c, help);
        check_parser(c);
        check_docs(c, man, readme);
        free(help);
    }
    ck_assert_msg(strstr(man, "-h, --help"), "docs/volev.1 does not list -h, --help");
    free(man);
    free(readme);
    free(overview);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

START_TEST(help_requests_and_mistakes)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-help");
    char *out, *err;
    /* an option's value is never taken for a help request */
    ck_assert_int_eq(volev("plot --title --help", NULL, &err), 2);
    ck_assert_msg(strstr(err, "missing DIR"), "%s", err);
    free(err);
    ck_assert_int_eq(volev("run missing.cfg -s -h=1", NULL, &err), 5); /* no such file */
    free(err);
    /* an unknown command: exit 2, with the nearest one when it looks like a typo */
    ck_assert_int_eq(volev("help rnu", &out, &err), 2);
    ck_assert_msg(out[0] == '\0' && strstr(err, "unknown command 'rnu' (did you mean 'run'?)"),
                  "%s", err);
    free(out);
    free(err);
    ck_assert_int_eq(volev("help frobnicate", NULL, &err), 2);
    ck_assert_msg(strstr(err, "unknown command 'frobnicate'") && !strstr(err, "did you mean"),
                  "%s", err);
    free(err);
    ck_assert_int_eq(volev("plott x", NULL, &err), 2);
    ck_assert_msg(strstr(err, "did you mean 'plot'"), "%s", err);
    free(err);
    ck_assert_int_eq(volev("help run plot", NULL, NULL), 2);
    /* a usage error points at the command's help */
    ck_assert_int_eq(volev("sweep", NULL, &err), 2);
    ck_assert_msg(strstr(err, "Try 'volev sweep --help'."), "%s", err);
    free(err);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

Suite *vl_suite_help(void)
{
    Suite *s = suite_create("help");
    TCase *tc = tcase_create("help");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, every_command_documented);
    tcase_add_test(tc, help_requests_and_mistakes);
    suite_add_tcase(s, tc);
    return s;
}
