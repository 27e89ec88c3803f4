/* help.h: the one description of the command line: every subcommand with its synopsis,
 * description, options and examples (src/cli/help_table.c). The dispatch in main.c, the
 * option check before a subcommand runs, `volev COMMAND --help`, `volev help COMMAND`
 * and the top-level overview all read it; docs/volev.1 and README.md are kept in
 * agreement with it by tests/test_help.c. */
#ifndef VOLEV_CLI_HELP_H
#define VOLEV_CLI_HELP_H

#include <stdio.h>

enum { VL_CLI_SPELLINGS = 2, VL_CLI_SYNOPSES = 2, VL_CLI_EXAMPLES = 6 };

/* One option: its spellings (short one first), the placeholder of its
 * value (NULL: a switch without value) and what it does. */
typedef struct vl_cli_option {
    const char *spellings[VL_CLI_SPELLINGS];
    const char *arg;
    const char *meaning;
} vl_cli_option;

/* One example: the command line and what it does. */
typedef struct vl_cli_example {
    const char *line, *what;
} vl_cli_example;

/* One subcommand. Invariant (tests/test_help.c): the options are exactly those its
 * parser accepts -- the check in vl_cli_check_options refuses any other before the
 * parser sees it, and the test runs every listed spelling through the parser. */
typedef struct vl_cli_command {
    const char *name;
    int (*fn)(int argc, char **argv);   /* argv[0] is the name */
    const char *synopsis[VL_CLI_SYNOPSES]; /* without "volev "; unused entries NULL */
    const char *summary;                /* one line, for the overview */
    const char *description;            /* one paragraph */
    const vl_cli_option *options;       /* ended by an entry without spellings */
    vl_cli_example examples[VL_CLI_EXAMPLES]; /* at least one; unused entries NULL */
} vl_cli_command;

/* Every subcommand, in the overview's order; ended by an entry without name. */
extern const vl_cli_command vl_cli_commands[];

/* The subcommand called name, or NULL. */
const vl_cli_command *vl_cli_command_find(const char *name);

/* The known command nearest to name by edit distance, when near enough to be a typo;
 * else NULL. */
const char *vl_cli_command_suggest(const char *name);

/* The overview: version, every synopsis with its summary, exit codes. */
void vl_cli_help_overview(FILE *f);

/* One command's help: synopsis, description, options (and -h, --help), examples. */
void vl_cli_help_command(const vl_cli_command *c, FILE *f);

/* Before the subcommand's parser runs, argv (argv[0] the command name) read against its
 * table: -h or --help anywhere, other than as an option's value, prints the command's
 * help and returns 0 with *done set; an option the table lacks is a usage error
 * (VL_ERR_USAGE, printed); otherwise 0 and *done clear. A lone "-" is left to the
 * parser. */
int vl_cli_check_options(const vl_cli_command *c, int argc, char **argv, int *done);

/* `volev help [COMMAND]`. */
int vl_cli_help(int argc, char **argv);

#endif
