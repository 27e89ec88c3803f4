/* sweep_journal.c: what `volev sweep` knows of finished members (sweep_internal.h): a
 * compact record per member, and the journal DIR/sweep.journal -- every finished member
 * appended at once with exact numbers, read back by a rerun of the same command so that
 * only the missing members run. */
#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "sweep_internal.h"
#include "volev/folder.h"

/* Copies m into its record, unless the member is kept already. */
void vl_cli_sweep_keep(vl_cli_sweep_ctx *c, const vl_member *m)
{
    vl_cli_record *r = &c->rec[m->index];
    if (r->have)
        return;
    r->have = 1;
    r->status = m->status;
    r->regime = m->regime;
    r->cls = m->cls;
    r->steps = m->steps;
    memcpy(r->out, m->out, sizeof r->out);
    memcpy(r->water, m->water_to, sizeof r->water);
    memcpy(r->o2, m->o2_bar, sizeof r->o2);
    r->reason = m->status != 0 && m->reason[0] ? strdup(m->reason) : NULL;
    c->done++;
}

/* Record i as a vl_member (its reason only for a failed member). */
void vl_cli_sweep_unpack(const vl_cli_sweep_ctx *c, long i, vl_member *m)
{
    const vl_cli_record *r = &c->rec[i];
    memset(m, 0, sizeof *m);
    m->index = i;
    m->status = r->status;
    m->regime = r->regime;
    m->cls = r->cls;
    m->steps = r->steps;
    memcpy(m->out, r->out, sizeof r->out);
    memcpy(m->water_to, r->water, sizeof r->water);
    memcpy(m->o2_bar, r->o2, sizeof r->o2);
    if (r->reason)
        snprintf(m->reason, sizeof m->reason, "%s", r->reason);
}

/* Rank 0: a finished member's journal line into the journal and the records. */
void vl_cli_sweep_take_line(vl_cli_sweep_ctx *c, const char *line)
{
    vl_member m;
    if (vl_sweep_journal_parse(line, &m) != 0 || m.index >= c->sw->members)
        return;
    if (c->rec[m.index].have)
        return;
    if (!c->io_error && (fputs(line, c->journal) < 0 || fflush(c->journal) != 0)) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "%s/%s: cannot append: %s", c->dir, VL_CLI_JOURNAL,
                 strerror(errno));
    }
    vl_cli_sweep_keep(c, &m);
    vl_cli_sweep_progress(c, 0);
}

/* ------------------------------------------------------------------ resume */

/* The members of an interrupted sweep's journal at path (the same hash on its first
 * line, else an error: another sweep's journal is never mixed in); the journal is
 * truncated after the last complete line. A missing journal is a fresh start. */
static int read_journal(vl_cli_sweep_ctx *c, const char *path, vl_status *st)
{
    FILE *f = fopen(path, "r+");
    if (!f)
        return errno == ENOENT ? VL_OK
                               : vl_fail(st, VL_ERR_IO, path, 0, "cannot open: %s", strerror(errno));
    char *line = NULL;
    size_t cap = 0;
    ssize_t len;
    long good_end = 0, lineno = 0;
    int rc = VL_OK;
    while ((len = getline(&line, &cap, f)) > 0) {
        lineno++;
        if (lineno == 1) {
            char want[128];
            snprintf(want, sizeof want, "%s%s\n", VL_CLI_JOURNAL_TAG, c->sw->hash);
            if (strcmp(line, want) != 0) {
                rc = vl_fail(st, VL_ERR_INPUT, path, 1,
                             "this folder holds an interrupted sweep with other settings (or "
                             "another volev version); choose another -o, or add --replace to "
                             "remove it and run this one");
                break;
            }
            good_end = ftell(f);
            continue;
        }
        vl_member m;
        if (vl_sweep_journal_parse(line, &m) != 0 || m.index >= c->sw->members)
            break; /* cut short by the interruption: drop it and what follows */
        vl_cli_sweep_keep(c, &m);
        good_end = ftell(f);
    }
    free(line);
    if (rc == VL_OK && lineno == 0)
        good_end = 0;
    if (rc == VL_OK && ftruncate(fileno(f), good_end) != 0)
        rc = vl_fail(st, VL_ERR_IO, path, 0, "cannot truncate: %s", strerror(errno));
    fclose(f);
    return rc;
}

/* The hash recorded in a finished members.csv (its second line), or "". */
static void finished_hash(const char *path, char out[17])
{
    out[0] = '\0';
    FILE *f = fopen(path, "r");
    if (!f)
        return;
    char line[512];
    for (int k = 0; k < 4 && fgets(line, sizeof line, f); k++) {
        const char *h = strstr(line, "sweep hash ");
        if (h && line[0] == '#') {
            snprintf(out, 17, "%.16s", h + 11);
            break;
        }
    }
    fclose(f);
}

/* The files of an earlier sweep in the folder, removed for --replace: its final files,
 * then its journal. */
static int remove_earlier(const vl_cli_sweep_ctx *c, vl_status *st)
{
    static const char *const names[] = {"members.csv", "ensemble_summary.csv",
                                        "ensemble_series.csv", "sensitivity.csv",
                                        "scenario.resolved.cfg", VL_CLI_JOURNAL, NULL};
    char path[1200];
    for (int k = 0; names[k]; k++) {
        snprintf(path, sizeof path, "%s/%s", c->dir, names[k]);
        if (unlink(path) != 0 && errno != ENOENT)
            return vl_fail(st, VL_ERR_IO, path, 0, "cannot remove (--replace): %s",
                           strerror(errno));
    }
    return VL_OK;
}

/* What the folder holds decides (the lock held, leftovers removed, fs its state): a
 * finished sweep (-1 if it is this one), an interrupted one (its journal), or nothing;
 * anything else is refused unless replace, which removes an earlier sweep's files. */
static int check_content(vl_cli_sweep_ctx *c, const vl_folder_state *fs, int replace,
                         vl_status *st)
{
    char path[1200];
    snprintf(path, sizeof path, "%s/members.csv", c->dir);
    int finished = access(path, F_OK) == 0;
    snprintf(path, sizeof path, "%s/%s", c->dir, VL_CLI_JOURNAL);
    int journal = access(path, F_OK) == 0;
    if (replace)
        return remove_earlier(c, st);
    if (finished) {
        char h[17];
        snprintf(path, sizeof path, "%s/members.csv", c->dir);
        finished_hash(path, h);
        if (strcmp(h, c->sw->hash) == 0)
            return -1;
        return vl_fail(st, VL_ERR_IO, c->dir, 0,
                       "holds the results of another sweep; choose another -o, or add "
                       "--replace to remove them and run this one");
    }
    if (!journal && fs->entries > 0)
        return vl_fail(st, VL_ERR_IO, c->dir, 0,
                       "the output folder is not empty (%s); choose another -o, or add "
                       "--replace to write this sweep's files over it",
                       fs->volev ? "it holds the results of an earlier volev command"
                                 : "it holds files volev did not write");
    return VL_OK;
}

/* Rank 0: output folder, lock, earlier state. Returns VL_OK to go on, -1 if already
 * finished. */
int vl_cli_sweep_prepare_dir(vl_cli_sweep_ctx *c, int replace, vl_status *st)
{
    char path[1200];
    if (mkdir(c->dir, 0777) != 0 && errno != EEXIST)
        return vl_fail(st, VL_ERR_IO, c->dir, 0, "cannot create folder: %s", strerror(errno));
    struct stat sb;
    if (stat(c->dir, &sb) != 0 || !S_ISDIR(sb.st_mode))
        return vl_fail(st, VL_ERR_IO, c->dir, 0, "not a folder");
    c->lock = vl_folder_lock(c->dir, st);
    if (c->lock < 0)
        return st->code;
    vl_folder_state fs;
    if (vl_folder_inspect(c->dir, &fs, st) != VL_OK)
        return st->code;
    c->removed = fs.removed;
    int rc = check_content(c, &fs, replace, st);
    if (rc)
        return rc;
    snprintf(path, sizeof path, "%s/%s", c->dir, VL_CLI_JOURNAL);
    rc = read_journal(c, path, st);
    if (rc)
        return rc;
    c->journal = fopen(path, "a");
    if (!c->journal)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    if (ftell(c->journal) == 0 &&
        (fprintf(c->journal, "%s%s\n", VL_CLI_JOURNAL_TAG, c->sw->hash) < 0 || fflush(c->journal) != 0))
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    return VL_OK;
}
