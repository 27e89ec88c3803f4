/* cache.c: the climate table cache of the commands that compute climates (run, sweep,
 * balance): its folder from the environment, and its warnings. */
#include <stdio.h>
#include <stdlib.h>

#include "cli.h"
#include "volev/climate.h"

/* The cache folder: $VOLEV_CACHE_DIR if set ("" turns the cache off), else
 * $XDG_CACHE_HOME/volev (an absolute path only, as the XDG base directory
 * specification asks), else $HOME/.cache/volev, else none (""). */
static const char *cache_folder(char *buf, size_t n)
{
    const char *dir = getenv("VOLEV_CACHE_DIR"), *xdg = getenv("XDG_CACHE_HOME"),
               *home = getenv("HOME");
    if (dir)
        return dir;
    if (xdg && xdg[0] == '/')
        snprintf(buf, n, "%s/volev", xdg);
    else if (home && home[0])
        snprintf(buf, n, "%s/.cache/volev", home);
    else
        buf[0] = '\0';
    return buf;
}

void vl_cli_cache_start(void)
{
    char buf[VL_PATH_MAX], msg[VL_MSG_MAX + VL_PATH_MAX + 32];
    vl_status st;
    if (vl_climate_cache_configure(cache_folder(buf, sizeof buf), &st) != VL_OK) {
        vl_status_format(&st, msg, sizeof msg);
        fprintf(stderr, "volev: warning: %s; running without the climate table cache\n", msg);
    }
}

void vl_cli_cache_finish(void)
{
    vl_climate_cache_flush();
    const char *e = vl_climate_cache_error();
    if (e)
        fprintf(stderr, "volev: warning: climate table cache turned off: %s\n", e);
}
