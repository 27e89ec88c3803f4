/* oxidation.c: the stoichiometry and O2 dependence shared by the rock O2 sinks
 * (oxidation.h). */
#include "oxidation.h"

/* Molar mass of FeO, kg/mol: 55.845 + 15.999 g/mol (IUPAC 2021 standard atomic weights). */
#define M_FEO 71.844e-3
/* Molar mass of S, kg/mol: 32.06 g/mol (IUPAC 2021 abridged standard atomic weight). */
#define M_S 32.06e-3

double vl_oxidation_feo_o2(double w_feo, double s)
{
    return w_feo * s / (4.0 * M_FEO);
}

double vl_oxidation_sulfide_o2(double w_s)
{
    return w_s * (15.0 / 8.0) / M_S;
}

double vl_oxidation_o2_share(double p_pa, double p_half_pa)
{
    return p_pa > 0.0 ? p_pa / (p_pa + p_half_pa) : 0.0;
}
