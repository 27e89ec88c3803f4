/* active.c: the state components a history can change (integrate_internal.h). The
 * integrator's vector, its error norm, its Jacobian and its linear solve hold only
 * these: a reservoir that starts empty and that no enabled process declares as a
 * destination stays exactly zero (every outflow is ramped to zero at zero mass,
 * flux.h), and the mantle's potential temperature of a mantle that never was molten
 * stays zero (melt_stage.c). */
#include "integrate_internal.h"
#include "volev/process.h"

/* Mark r and its deuterium companion as destinations. */
static void mark(unsigned char *dest, int r)
{
    dest[r] = 1;
    int d = vl_reservoir_deuterium(r);
    if (d >= 0)
        dest[d] = 1;
}

/* Every reservoir an enabled process may add mass to: the receiving end of a declared
 * transfer and every product of a declared reaction, with their deuterium companions
 * (deuterium follows hydrogen, flux.h). */
static void destinations(const vl_model *m, unsigned char *dest)
{
    for (size_t i = 0; i < m->nproc; i++) {
        const vl_process *p = m->proc[i];
        for (size_t k = 0; k < p->ntransfers; k++)
            mark(dest, p->transfers[k].to);
        for (size_t k = 0; k < p->nreactions; k++)
            for (int q = 0; q < p->reactions[k].n; q++)
                if (p->reactions[k].nu[q] > 0.0)
                    mark(dest, p->reactions[k].res[q]);
    }
}

int vl_active_components(const vl_model *m, const double *y0, int *idx)
{
    unsigned char dest[VL_NSTATE] = {0};
    destinations(m, dest);
    int n = 0;
    for (int j = 0; j < VL_NRES; j++)
        if (y0[j] != 0.0 || dest[j])
            idx[n++] = j;
    if (y0[VL_S_MANTLE_TP] != 0.0)
        idx[n++] = VL_S_MANTLE_TP;
    return n;
}
