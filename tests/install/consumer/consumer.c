/* Uses the installed C ABI: prints ΔrH° of the water-gas shift at 1000 K, then one error. */
#include <rxnheat/rxnheat.h>

#include <stdio.h>

int main(void) {
    char err[512];
    double v = 0;
    rxnheat_engine* e = rxnheat_open();
    if (!e) return 2;
    if (rxnheat_dh(e, "CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000.0, NULL, NULL, &v, err, sizeof err) != RXNHEAT_OK) {
        fprintf(stderr, "%s\n", err);
        return 3;
    }
    printf("%.2f\n", v);
    rxnheat_status st = rxnheat_dh(e, "CH4(g) -> C(s) + 2 H2(g)", 150.0, NULL, NULL, &v, err, sizeof err);
    printf("status %d: %s\n", (int)st, err);
    rxnheat_close(e);
    return st == RXNHEAT_E_OUT_OF_RANGE ? 0 : 4;
}
