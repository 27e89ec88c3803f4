/* sweep_ranks.c: running the members of a sweep (sweep_internal.h): on OpenMP threads
 * and, in a `make MPI=1` build, on MPI ranks (round robin over the members still to
 * run; rank 0 gathers every finished member and journals it); SIGINT/SIGTERM stop
 * taking members and stop the running ones (they are not recorded); the progress line. */
#include <math.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <unistd.h>

#ifdef _OPENMP
#include <omp.h>
#endif
#ifdef VL_MPI
#include <mpi.h>
#endif

#include "sweep_internal.h"
#include "volev/integrate.h"

/* ------------------------------------------------------------------ signals, progress */

static volatile sig_atomic_t stop_signal;

/* Stop taking members, and stop the running ones (they are not recorded). */
static void on_signal(int sig)
{
    stop_signal = sig;
    vl_integrate_request_stop(sig);
}

/* SIGINT and SIGTERM go to on_signal. */
static void catch_signals(void)
{
    struct sigaction sa;
    memset(&sa, 0, sizeof sa);
    sa.sa_handler = on_signal;
    sigaction(SIGINT, &sa, NULL);
    sigaction(SIGTERM, &sa, NULL);
}

int vl_cli_sweep_stopped(void) { return stop_signal; }

double vl_cli_sweep_now(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

/* "\rvolev sweep: DONE/ALL members, RATE/s, HH:MM:SS left" on standard error. */
void vl_cli_sweep_progress(vl_cli_sweep_ctx *c, int final)
{
    if (!c->progress)
        return;
    double t = vl_cli_sweep_now();
    if (!final && t - c->t_last < 0.5)
        return;
    c->t_last = t;
    long new_done = c->done - c->done_at_start;
    double rate = (double)new_done / fmax(t - c->t_start, 1e-9);
    double left = rate > 0.0 ? (double)(c->sw->members - c->done) / rate : 0.0;
    fprintf(stderr, "\rvolev sweep: %ld/%ld members, %.1f/s, %02d:%02d:%02d left   ", c->done,
            c->sw->members, rate, (int)(left / 3600.0), (int)fmod(left / 60.0, 60.0),
            (int)fmod(left, 60.0));
    if (final)
        fputc('\n', stderr);
    fflush(stderr);
}

/* ------------------------------------------------------------------ members between ranks */

#ifdef VL_MPI
enum { TAG_LINE = 1, TAG_DONE = 2 };

/* Rank 0: receive what is waiting (block: wait for one message). Returns 1 for a
 * TAG_DONE message. */
static int receive_one(vl_cli_sweep_ctx *c, int block)
{
    MPI_Status ms;
    int flag = 1;
    if (block)
        MPI_Probe(MPI_ANY_SOURCE, MPI_ANY_TAG, MPI_COMM_WORLD, &ms);
    else
        MPI_Iprobe(MPI_ANY_SOURCE, MPI_ANY_TAG, MPI_COMM_WORLD, &flag, &ms);
    if (!flag)
        return -1;
    int len;
    MPI_Get_count(&ms, MPI_CHAR, &len);
    char *buf = malloc((size_t)len + 1);
    if (!buf) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "out of memory");
        MPI_Abort(MPI_COMM_WORLD, 1);
    }
    MPI_Recv(buf, len, MPI_CHAR, ms.MPI_SOURCE, ms.MPI_TAG, MPI_COMM_WORLD, MPI_STATUS_IGNORE);
    buf[len] = '\0';
    if (ms.MPI_TAG == TAG_LINE)
        vl_cli_sweep_take_line(c, buf);
    free(buf);
    return ms.MPI_TAG == TAG_DONE;
}
#endif

/* A member finished on this rank (called inside a critical section). */
static void finished(vl_cli_sweep_ctx *c, const vl_member *m)
{
    char *line = vl_sweep_journal_line(m);
    if (!line) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "out of memory");
        return;
    }
    if (c->rank == 0) {
        vl_cli_sweep_take_line(c, line);
#ifdef VL_MPI
        while (c->size > 1 && receive_one(c, 0) >= 0)
            ;
#endif
    } else {
#ifdef VL_MPI
        MPI_Send(line, (int)strlen(line), MPI_CHAR, 0, TAG_LINE, MPI_COMM_WORLD);
#endif
    }
    free(line);
}

/* ------------------------------------------------------------------ MPI ranks */

void vl_cli_sweep_mpi_start(int *argc, char ***argv, vl_cli_sweep_ctx *c, int *threads)
{
    c->rank = 0;
    c->size = 1;
#ifdef VL_MPI
    int provided;
    MPI_Init_thread(argc, argv, MPI_THREAD_SERIALIZED, &provided);
    MPI_Comm_rank(MPI_COMM_WORLD, &c->rank);
    MPI_Comm_size(MPI_COMM_WORLD, &c->size);
    if (provided < MPI_THREAD_SERIALIZED)
        *threads = 1; /* members on one thread per rank */
#else
    (void)argc;
    (void)argv;
    (void)threads;
#endif
}

void vl_cli_sweep_mpi_end(void)
{
#ifdef VL_MPI
    MPI_Finalize();
#endif
}

int vl_cli_sweep_share_state(const vl_cli_sweep_ctx *c, int *rc, int already)
{
#ifdef VL_MPI
    int state[2] = {*rc, already};
    MPI_Bcast(state, 2, MPI_INT, 0, MPI_COMM_WORLD);
    if (c->rank != 0 && (state[0] != VL_OK || state[1])) {
        *rc = state[0];
        return 1;
    }
#else
    (void)c;
    (void)rc;
    (void)already;
#endif
    return 0;
}

int vl_cli_sweep_share_done(const vl_cli_sweep_ctx *c, char **done, vl_status *st)
{
    *done = calloc((size_t)c->sw->members, 1);
    if (!*done)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    for (long i = 0; i < c->sw->members; i++)
        (*done)[i] = (char)c->rec[i].have;
#ifdef VL_MPI
    MPI_Bcast(*done, (int)c->sw->members, MPI_CHAR, 0, MPI_COMM_WORLD);
#endif
    return VL_OK;
}

/* ------------------------------------------------------------------ running */

/* This rank's share of the members not done (round robin over them), in member order;
 * NULL if out of memory. */
static long *my_members(const vl_cli_sweep_ctx *c, const char *done, long *nmine)
{
    long npend = 0, k = 0;
    for (long i = 0; i < c->sw->members; i++)
        if (!done[i])
            npend++;
    long *mine = malloc((size_t)(npend ? npend : 1) * sizeof *mine);
    *nmine = 0;
    for (long i = 0; mine && i < c->sw->members; i++)
        if (!done[i] && k++ % c->size == c->rank)
            mine[(*nmine)++] = i;
    return mine;
}

/* Runs the nmine members of mine on the threads; returns how many were recorded. */
static long run_members(vl_cli_sweep_ctx *c, const long *mine, long nmine, int threads)
{
#ifdef _OPENMP
    if (threads < 1)
        threads = omp_get_max_threads();
#else
    threads = 1;
#endif
    (void)threads;
    long sent = 0;
#pragma omp parallel for schedule(dynamic, 1) num_threads(threads) reduction(+ : sent)
    for (long j = 0; j < nmine; j++) {
        if (stop_signal || c->io_error) /* an unwritable journal: stop taking members */
            continue;
        vl_member *m = malloc(sizeof *m);
        if (!m)
            continue;
        vl_sweep_run_member(c->sw, mine[j], m);
        if (m->status != VL_ERR_STOPPED) { /* a member cut short is run again on resume */
#pragma omp critical(volev_sweep_out)
            finished(c, m);
            sent++;
        }
        free(m);
    }
    return sent;
}

/* The ranks other than 0 say they are done; rank 0 takes their members until each did. */
static void gather_ranks(vl_cli_sweep_ctx *c, long sent)
{
#ifdef VL_MPI
    if (c->rank != 0) {
        long s = sent;
        MPI_Send(&s, (int)sizeof s, MPI_CHAR, 0, TAG_DONE, MPI_COMM_WORLD);
    } else {
        for (int left = c->size - 1; left > 0;)
            if (receive_one(c, 1) == 1)
                left--;
    }
#else
    (void)c;
    (void)sent;
#endif
}

int vl_cli_sweep_run(vl_cli_sweep_ctx *c, const char *done, int threads, int quiet,
                     vl_status *st)
{
    catch_signals();
    long nmine;
    long *mine = my_members(c, done, &nmine);
    c->progress = c->rank == 0 && !quiet && isatty(STDERR_FILENO);
    c->t_start = c->t_last = vl_cli_sweep_now();
    c->done_at_start = c->done;
    int rc = mine ? VL_OK : vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    long sent = run_members(c, mine, mine ? nmine : 0, threads);
    gather_ranks(c, sent);
    free(mine);
    return rc;
}
