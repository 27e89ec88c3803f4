/* help.c: the help texts printed from the command table (help_table.c), `volev help`,
 * and the check of a command's options against the table before its parser runs. */
#include "help.h"

#include <string.h>

#include "cli.h"
#include "volev/output.h"
#include "volev/params.h"

enum { WIDTH = 80, OPTION_COLUMN = 24 };

static const vl_cli_option help_option = {{"-h", "--help"}, NULL, "print this help and exit"};

const vl_cli_command *vl_cli_command_find(const char *name)
{
    for (const vl_cli_command *c = vl_cli_commands; c->name; c++)
        if (strcmp(c->name, name) == 0)
            return c;
    return NULL;
}

/* A typo: at most two edits, and fewer than the name's length (so "x" suggests nothing). */
const char *vl_cli_command_suggest(const char *name)
{
    const char *best = NULL;
    size_t best_d = 3;
    for (const vl_cli_command *c = vl_cli_commands; c->name; c++) {
        size_t d = vl_edit_distance(name, c->name);
        if (d < best_d && d < strlen(name)) {
            best = c->name;
            best_d = d;
        }
    }
    return best;
}

/* text at column indent, words wrapped at WIDTH; the first line starts at column col
 * (the cursor's). Ends with a newline. */
static void wrap(FILE *f, const char *text, int indent, int col)
{
    const char *p = text;
    while (*p) {
        size_t word = strcspn(p, " ");
        if (col > indent && col + 1 + (int)word > WIDTH) {
            fprintf(f, "\n%*s", indent, "");
            col = indent;
        } else if (col > indent) {
            fputc(' ', f);
            col++;
        }
        fwrite(p, 1, word, f);
        col += (int)word;
        p += word;
        while (*p == ' ')
            p++;
    }
    fputc('\n', f);
}

/* "  -o, --output DIR      meaning", the meaning wrapped at OPTION_COLUMN. */
static void print_option(FILE *f, const vl_cli_option *o)
{
    int col = fprintf(f, "  %s", o->spellings[0]);
    for (int k = 1; k < VL_CLI_SPELLINGS && o->spellings[k]; k++)
        col += fprintf(f, ", %s", o->spellings[k]);
    if (o->arg)
        col += fprintf(f, " %s", o->arg);
    if (col + 2 > OPTION_COLUMN) {
        fputc('\n', f);
        col = 0;
    }
    fprintf(f, "%*s", OPTION_COLUMN - col, "");
    wrap(f, o->meaning, OPTION_COLUMN, OPTION_COLUMN);
}

void vl_cli_help_command(const vl_cli_command *c, FILE *f)
{
    for (int k = 0; k < VL_CLI_SYNOPSES && c->synopsis[k]; k++)
        fprintf(f, "%s volev %s\n", k ? "   or:" : "usage:", c->synopsis[k]);
    fputc('\n', f);
    wrap(f, c->description, 0, 0);
    fprintf(f, "\noptions:\n");
    for (const vl_cli_option *o = c->options; o->spellings[0]; o++)
        print_option(f, o);
    print_option(f, &help_option);
    fprintf(f, "\nexamples:\n");
    for (int k = 0; k < VL_CLI_EXAMPLES && c->examples[k].line; k++) {
        fprintf(f, "  %s\n", c->examples[k].line);
        fprintf(f, "      # %s\n", c->examples[k].what);
    }
    fprintf(f, "\nSee volev(1) and docs/model.md.\n");
}

void vl_cli_help_overview(FILE *f)
{
    fprintf(f, "volev %s: volatile and atmosphere evolution of rocky planets\n\n"
               "usage: volev COMMAND [ARGS]\n",
            vl_version());
    for (const vl_cli_command *c = vl_cli_commands; c->name; c++) {
        for (int k = 0; k < VL_CLI_SYNOPSES && c->synopsis[k]; k++)
            fprintf(f, "  volev %s\n", c->synopsis[k]);
        fprintf(f, "%*s", 6, "");
        wrap(f, c->summary, 6, 6);
    }
    fprintf(f, "  volev --help | --version\n\n"
               "'volev COMMAND --help' or 'volev help COMMAND': the command's options and "
               "examples.\n\n"
               "exit codes: 0 success, 1 internal error, 2 bad command line,\n"
               "  3 bad scenario or input data, 4 integration failed, 5 file I/O error\n"
               "  (or the output folder is taken: not empty, or locked by another sweep),\n"
               "  6 external program (gnuplot) missing or failed,\n"
               "  128 + signal: stopped by SIGINT or SIGTERM (nothing incomplete left behind)\n"
               "See volev(1) and docs/model.md.\n");
}

/* The option of c spelled s, or NULL. */
static const vl_cli_option *find_option(const vl_cli_command *c, const char *s)
{
    for (const vl_cli_option *o = c->options; o->spellings[0]; o++)
        for (int k = 0; k < VL_CLI_SPELLINGS && o->spellings[k]; k++)
            if (strcmp(o->spellings[k], s) == 0)
                return o;
    return NULL;
}

static int is_help(const char *s) { return strcmp(s, "-h") == 0 || strcmp(s, "--help") == 0; }

int vl_cli_check_options(const vl_cli_command *c, int argc, char **argv, int *done)
{
    const char *unknown = NULL;
    *done = 0;
    for (int i = 1; i < argc; i++) {
        const char *s = argv[i];
        if (s[0] != '-' || s[1] == '\0')
            continue;
        if (is_help(s)) {
            vl_cli_help_command(c, stdout);
            *done = 1;
            return VL_OK;
        }
        const vl_cli_option *o = find_option(c, s);
        if (!o && !unknown)
            unknown = s;
        if (o && o->arg)
            i++; /* its value, whatever it looks like */
    }
    if (unknown)
        return vl_cli_usage_error(c->name, "unknown option '%s'", unknown);
    return VL_OK;
}

int vl_cli_help(int argc, char **argv)
{
    if (argc == 1) {
        vl_cli_help_overview(stdout);
        return VL_OK;
    }
    if (argc > 2)
        return vl_cli_usage_error(argv[0], "expected one COMMAND, got '%s' and '%s'", argv[1],
                                  argv[2]);
    const vl_cli_command *c = vl_cli_command_find(argv[1]);
    if (!c) {
        const char *near = vl_cli_command_suggest(argv[1]);
        return vl_cli_usage_error(argv[0], "unknown command '%s'%s%s%s", argv[1],
                                  near ? " (did you mean '" : "", near ? near : "",
                                  near ? "'?)" : "");
    }
    vl_cli_help_command(c, stdout);
    return VL_OK;
}
