/* sweep_internal.h: what the files of `volev sweep` share (src/cli/ only):
 *   sweep.c          the command: arguments, output folder, the steps in order, report
 *   sweep_journal.c  finished members kept in memory, the journal (append, resume)
 *   sweep_ranks.c    running the members: threads (OpenMP), MPI ranks (#ifdef VL_MPI),
 *                    signals, progress
 *   sweep_files.c    the final files, written from the kept members in member order */
#ifndef VOLEV_CLI_SWEEP_INTERNAL_H
#define VOLEV_CLI_SWEEP_INTERNAL_H

#include <stdio.h>

#include "volev/status.h"
#include "volev/sweep.h"

#define VL_CLI_JOURNAL "sweep.journal"
#define VL_CLI_JOURNAL_TAG "# volev sweep journal "

/* Compact record of a finished member (the reason only when it failed). */
typedef struct vl_cli_record {
    int have;
    int status, regime, cls;
    long steps;
    double out[VL_NOUT];
    double water[VL_SWEEP_NT], o2[VL_SWEEP_NT];
    char *reason;
} vl_cli_record;

/* The state of one sweep command. */
typedef struct vl_cli_sweep_ctx {
    const vl_sweep *sw;
    const char *dir;
    vl_cli_record *rec;     /* one per member */
    long done;              /* members with a record */
    FILE *journal;          /* rank 0 */
    volatile int io_error;
    char io_msg[VL_MSG_MAX];
    int progress;           /* print a progress line (terminal, not --quiet) */
    double t_start, t_last;
    long done_at_start;
    int rank, size;
    int lock;               /* rank 0: the folder's lock (vl_folder_lock), -1 if none */
    long removed;           /* rank 0: temporaries of a killed volev removed from the folder */
} vl_cli_sweep_ctx;

/* ---- sweep_journal.c */

/* Keeps finished member m (once; later copies are ignored). */
void vl_cli_sweep_keep(vl_cli_sweep_ctx *c, const vl_member *m);
/* The kept member i as a vl_member. */
void vl_cli_sweep_unpack(const vl_cli_sweep_ctx *c, long i, vl_member *m);
/* Rank 0: a finished member's journal line into the journal and the records. */
void vl_cli_sweep_take_line(vl_cli_sweep_ctx *c, const char *line);
/* Rank 0: the output folder, locked against a second writer (c->lock), its leftover
 * temporaries removed (c->removed), and its earlier state: members read back from the
 * journal of an interrupted sweep with the same hash, the journal opened for appending.
 * A folder holding anything else (another sweep's results or journal, other files) is
 * refused, unless replace: then an earlier sweep's files are removed first. Returns
 * VL_OK to go on, -1 if the folder holds this sweep's results already (and not replace). */
int vl_cli_sweep_prepare_dir(vl_cli_sweep_ctx *c, int replace, vl_status *st);

/* ---- sweep_ranks.c */

/* MPI start (a VL_MPI build): this process's rank and the rank count in c; threads = 1
 * when the library cannot serve threads. Without MPI: rank 0 of 1. */
void vl_cli_sweep_mpi_start(int *argc, char ***argv, vl_cli_sweep_ctx *c, int *threads);
void vl_cli_sweep_mpi_end(void);
/* Every rank learns rank 0's state (rc, already). Returns 1 on a rank other than 0 that
 * must stop there (with *rc its exit code). */
int vl_cli_sweep_share_state(const vl_cli_sweep_ctx *c, int *rc, int already);
/* Which members are done, as rank 0 knows it, on every rank (*done: members bytes). */
int vl_cli_sweep_share_done(const vl_cli_sweep_ctx *c, char **done, vl_status *st);
/* Runs this rank's share of the members not done on `threads` threads (< 1: all
 * cores); rank 0 journals every finished member, its own and the other ranks'.
 * SIGINT/SIGTERM stop taking members. */
int vl_cli_sweep_run(vl_cli_sweep_ctx *c, const char *done, int threads, int quiet,
                     vl_status *st);
/* The signal that stopped the sweep, 0 if none. */
int vl_cli_sweep_stopped(void);
/* Monotonic clock, s. */
double vl_cli_sweep_now(void);
/* Rank 0: the progress line (at most twice a second; final: with a newline). */
void vl_cli_sweep_progress(vl_cli_sweep_ctx *c, int final);

/* ---- sweep_files.c */

/* Rank 0: members.csv, scenario.resolved.cfg, ensemble_summary.csv,
 * ensemble_series.csv and (saltelli) sensitivity.csv, under temporary names renamed
 * when complete (members.csv last); nothing left behind on error. */
int vl_cli_sweep_write_outputs(const vl_cli_sweep_ctx *c, vl_status *st);

#endif
