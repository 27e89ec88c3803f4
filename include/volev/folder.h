/* folder.h: an output folder before a command writes into it (docs/hardening.md,
 * "Outputs"): what it holds, the temporaries a killed volev left in it, and the
 * lock that keeps a second writer out.
 *
 * volev writes every output file as a hidden temporary `.NAME.PID.tmp` in the folder
 * (PID: the writing process) and renames it to NAME when complete. A temporary whose
 * process no longer runs was left by a killed run or sweep; vl_folder_inspect removes
 * it. One of a process that still runs is left alone and counted as busy. */
#ifndef VOLEV_FOLDER_H
#define VOLEV_FOLDER_H

#include "volev/status.h"

/* The lock file of a sweep folder (vl_folder_lock). */
#define VL_FOLDER_LOCK ".volev.lock"

/* What vl_folder_inspect found. */
typedef struct vl_folder_state {
    int exists;     /* the folder exists */
    long entries;   /* entries other than '.', '..', the lock file and removed leftovers */
    int volev;      /* one of them is an output file volev wrote (first line "# volev ") */
    long removed;   /* temporaries of a volev process that no longer runs, removed */
    long busy;      /* temporaries of a volev process that still runs (counted in entries) */
} vl_folder_state;

/* The state of folder dir (a missing folder: exists 0, the rest 0), after removing the
 * temporaries of output files whose writer no longer runs. VL_ERR_IO when dir is not a
 * folder or cannot be read, or a leftover cannot be removed. */
int vl_folder_inspect(const char *dir, vl_folder_state *fs, vl_status *st);

/* The temporary name of output file `name` in dir for this process: dir/.name.PID.tmp. */
void vl_folder_temp_name(char *buf, size_t n, const char *dir, const char *name);

/* Takes the lock of folder dir for this process: dir/.volev.lock, created if missing,
 * locked with flock(2) (released by the system when the process ends, however it ends:
 * a lock file left by a killed process blocks nothing) and holding the holder's pid.
 * Returns the lock's descriptor (>= 0), or -1 with st filled: VL_ERR_IO, naming the pid
 * of the holder when another process holds it. */
int vl_folder_lock(const char *dir, vl_status *st);

/* Releases a lock taken by vl_folder_lock and removes its file (fd < 0: nothing). */
void vl_folder_unlock(const char *dir, int fd);

#endif
