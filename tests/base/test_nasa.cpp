// Tests of the NASA Glenn reader (engine/src/nasa.cpp) on the shipped thermo.inp and on
// synthetic texts. Outside sources are named beside each check.
#include <catch2/catch.hpp>

#include "nasa.hpp"
#include "tables.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>
#include <set>
#include <sstream>
#include <stdexcept>
#include <string>

using namespace rxnheat::detail;

namespace {

const std::vector<Record>& records() {
    static const std::vector<Record> r = parse_nasa_glenn(embedded_thermo_inp());
    return r;
}

const Record& rec(const std::string& name) {
    for (const Record& r : records())
        if (r.name == name) return r;
    FAIL("no record " << name);
    throw std::logic_error("unreachable");
}

double count_of(const Record& r, const std::string& sym) {
    for (auto& [s, c] : r.elements)
        if (s == sym) return c;
    return 0;
}

// Thermodynamic functions of a record, SI units, with R as the coefficients were fitted.
double Cp(const Record& r, double T) {
    const Interval* iv = find_interval(r, T);
    REQUIRE(iv != nullptr);
    return cp_over_R(*iv, T) * R_nasa;
}
double H(const Record& r, double T) {  // J/mol, assigned enthalpy (= ΔfH° at 298.15 K)
    const Interval* iv = find_interval(r, T);
    REQUIRE(iv != nullptr);
    return h_over_RT(*iv, T) * R_nasa * T;
}
double S(const Record& r, double T) {
    const Interval* iv = find_interval(r, T);
    REQUIRE(iv != nullptr);
    return s_over_R(*iv, T) * R_nasa;
}

// ---- synthetic thermo.inp texts, written in the file's fixed columns -------------------------

std::string dnum(double v) {  // one D16.9 field
    char buf[32];
    std::snprintf(buf, sizeof buf, "%16.9E", v);
    std::string s(buf);
    std::replace(s.begin(), s.end(), 'E', 'D');
    return s;
}

struct SynInterval {
    double tmin, tmax;
    double a2 = 3.5;  // constant Cp/R
    double b1 = 0, b2 = 0;
};

std::string syn_record(const std::string& name, const std::vector<SynInterval>& ivs,
                       const std::string& elements = "C   1.00O   2.00    0.00    0.00    0.00",
                       int phase = 0, double mw = 44.0095, double hf = -393510.0) {
    char l2[128];
    std::snprintf(l2, sizeof l2, "%2d g 1/01 %-40s%2d%13.7f%15.3f", static_cast<int>(ivs.size()),
                  elements.c_str(), phase, mw, hf);
    std::string s = name + std::string(18 - std::min<std::size_t>(name.size(), 17), ' ') + "Synthetic.\n";
    s += std::string(l2) + "\n";
    for (const SynInterval& iv : ivs) {
        char l3[128];
        std::snprintf(l3, sizeof l3, "%11.3f%11.3f7 -2.0 -1.0  0.0  1.0  2.0  3.0  4.0  0.0  %15.3f", iv.tmin,
                      iv.tmax, 9000.0);
        s += std::string(l3) + "\n";
        s += dnum(0) + dnum(0) + dnum(iv.a2) + dnum(0) + dnum(0) + "\n";
        s += dnum(0) + dnum(0) + std::string(16, ' ') + dnum(iv.b1) + dnum(iv.b2) + "\n";
    }
    return s;
}

const std::string syn_header =
    "! synthetic test file\n"
    "!\n"
    "thermo\n"
    "    200.00   1000.00   6000.00  20000.     9/09/04\n";  // lines 1-4; records start on line 5

std::string syn_file(const std::string& records, const std::string& reactants = "") {
    return syn_header + records + "END PRODUCTS\n" + reactants + "END REACTANTS\n";
}

// Checks that parsing fails with a message naming the line and containing `what`.
void expect_error(const std::string& text, std::size_t line, const std::string& what) {
    try {
        parse_nasa_glenn(text);
        FAIL("no error; expected line " << line << ": " << what);
    } catch (const std::runtime_error& e) {
        const std::string msg = e.what();
        INFO(msg);
        CHECK(msg.rfind("thermo.inp line " + std::to_string(line) + ": ", 0) == 0);
        CHECK(msg.find(what) != std::string::npos);
    }
}

}  // namespace

TEST_CASE("thermo.inp: record counts and valid ranges", "[nasa]") {
    const auto& rs = records();
    std::size_t gas = 0, liquid = 0, solid = 0, zero = 0, reactant = 0, merged = 0, continuation = 0;
    for (const Record& r : rs) {
        (r.phase == PhaseKind::gas ? gas : r.phase == PhaseKind::liquid ? liquid : solid)++;
        if (r.intervals.empty()) ++zero;
        if (r.reactant_only) ++reactant;
        if (!r.merged_lines.empty()) ++merged;
        continuation += r.merged_lines.size();
        INFO(r.name << " (line " << r.line << ")");
        CHECK(!r.name.empty());
        CHECK(r.molar_mass > 0);
        CHECK((r.phase == PhaseKind::gas) == (r.phase_code == 0));
        if (r.intervals.empty()) {
            CHECK(r.t_single > 0);
        } else {
            for (std::size_t k = 0; k < r.intervals.size(); ++k) {
                CHECK(r.intervals[k].tmin > 0);
                CHECK(r.intervals[k].tmax > r.intervals[k].tmin);
                if (k > 0) CHECK(r.intervals[k].tmin == r.intervals[k - 1].tmax);
            }
            CHECK(r.tmax() <= 20000.0);
        }
    }
    WARN("thermo.inp: " << rs.size() << " records (" << gas << " gas, " << liquid << " liquid, " << solid
                        << " solid; " << zero << " without intervals; " << reactant << " reactant-only; "
                        << merged << " merged from " << merged + continuation << " file records)");
    // The file has 2,086 records; 11 of them continue the record before them (same name).
    CHECK(rs.size() == 2075);
    CHECK(gas == 1267);
    CHECK(liquid == 333);
    CHECK(solid == 475);
    CHECK(merged == 10);
    CHECK(continuation == 11);
    CHECK(zero == 39);
    CHECK(reactant == 62);
    // Names are unique after merging.
    std::set<std::string> names;
    for (const Record& r : rs) CHECK(names.insert(r.name).second);
    // The first and the last record of each part of the file.
    CHECK(rs.front().name == "e-");
    CHECK(rs.back().name == "RP-1");
    CHECK_FALSE(rec("ZrO2(L)").reactant_only);
    CHECK(rec("Air").reactant_only);
}

TEST_CASE("thermo.inp: records continued across a transition are merged", "[nasa]") {
    // Fe(a): alpha iron below and above the Curie (lambda) point, two file records.
    const Record& fe = rec("Fe(a)");
    CHECK(fe.tmin() == 200.0);
    CHECK(fe.tmax() == 1184.0);
    CHECK(fe.intervals.size() == 4);
    CHECK(fe.merged_lines.size() == 1);
    CHECK(fe.phase == PhaseKind::solid);
    bool has_1042 = false;
    for (const auto& iv : fe.intervals) has_1042 |= iv.tmax == 1042.0;
    CHECK(has_1042);
    // The other phases of iron are separate records with adjacent ranges.
    CHECK(rec("Fe(c)").tmin() == 1184.0);
    CHECK(rec("Fe(d)").tmin() == rec("Fe(c)").tmax());
    CHECK(rec("Fe(L)").tmin() == rec("Fe(d)").tmax());
    CHECK(rec("Fe(L)").phase == PhaseKind::liquid);
    // Fe2O3(cr): hematite below and above its Curie point; starts at 298.15 K.
    const Record& hem = rec("Fe2O3(cr)");
    CHECK(hem.tmin() == 298.15);
    CHECK(hem.merged_lines.size() == 1);
    bool has_960 = false;
    for (const auto& iv : hem.intervals) has_960 |= iv.tmin == 960.0;
    CHECK(has_960);
    // Cr2O3(I) is three file records.
    CHECK(rec("Cr2O3(I)").merged_lines.size() == 2);
    CHECK(rec("Cr2O3(I)").tmin() == 306.0);
}

TEST_CASE("merging: a gap or an overlap between continued records is an error", "[nasa]") {
    const std::string a = syn_record("Xy(cr)", {{200, 500}}, "FE  1.00    0.00    0.00    0.00    0.00", 1, 55.845, 0);
    const std::string ok = a + syn_record("Xy(cr)", {{500, 900}}, "FE  1.00    0.00    0.00    0.00    0.00", 2, 55.845, 0);
    auto rs = parse_nasa_glenn(syn_file(ok));
    REQUIRE(rs.size() == 1);
    CHECK(rs[0].tmin() == 200.0);
    CHECK(rs[0].tmax() == 900.0);
    CHECK(rs[0].merged_lines == std::vector<std::size_t>{10});
    // Second record begins on line 5 + 5 = 10.
    const std::string gap = a + syn_record("Xy(cr)", {{600, 900}}, "FE  1.00    0.00    0.00    0.00    0.00", 2, 55.845, 0);
    expect_error(syn_file(gap), 10, "(a gap)");
    const std::string overlap = a + syn_record("Xy(cr)", {{450, 900}}, "FE  1.00    0.00    0.00    0.00    0.00", 2, 55.845, 0);
    expect_error(syn_file(overlap), 10, "(an overlap)");
    const std::string other = a + syn_record("Xy(cr)", {{500, 900}}, "FE  2.00    0.00    0.00    0.00    0.00", 2, 111.69, 0);
    expect_error(syn_file(other), 10, "composition");
    // The same name again, not adjacent: an error, not a silent duplicate.
    const std::string apart = a + syn_record("CO2", {{200, 1000}}) +
                              syn_record("Xy(cr)", {{500, 900}}, "FE  1.00    0.00    0.00    0.00    0.00", 2, 55.845, 0);
    expect_error(syn_file(apart), 15, "repeats the name");
}

TEST_CASE("thermo.inp: composition comes from the element fields", "[nasa]") {
    const Record& hcl = rec("HCL");
    CHECK(hcl.elements.size() == 2);
    CHECK(count_of(hcl, "H") == 1);
    CHECK(count_of(hcl, "Cl") == 1);
    const Record& oct = rec("C8H18,n-octane");
    CHECK(oct.elements.size() == 2);
    CHECK(count_of(oct, "C") == 8);
    CHECK(count_of(oct, "H") == 18);
    const Record& octl = rec("C8H18(L),n-octa");
    CHECK(count_of(octl, "C") == 8);
    CHECK(count_of(octl, "H") == 18);
    CHECK(octl.phase == PhaseKind::liquid);
    const Record& al2o3 = rec("AL2O3(a)");
    CHECK(count_of(al2o3, "Al") == 2);
    CHECK(count_of(al2o3, "O") == 3);
    // Decimal counts are kept as written (Air: mole fractions per mean mole).
    const Record& air = rec("Air");
    CHECK(count_of(air, "N") == Approx(1.5617).epsilon(1e-12));
    CHECK(count_of(air, "O") == Approx(0.41959).epsilon(1e-12));
    CHECK(count_of(air, "Ar") == Approx(0.00937).epsilon(1e-12));
    CHECK(count_of(air, "C") == Approx(0.00032).epsilon(1e-12));
    CHECK(air.elements.size() == 4);
    CHECK(air.phase == PhaseKind::gas);
    // Wustite: the name says Fe.947O, the element field (and the molecular weight) Fe0.95O.
    CHECK(count_of(rec("Fe.947O(cr)"), "Fe") == 0.95);
    // Every symbol is normalised: a capital, then small letters.
    for (const Record& r : records())
        for (auto& [s, c] : r.elements) {
            INFO(r.name << " " << s);
            CHECK(std::isupper(static_cast<unsigned char>(s[0])));
            CHECK(std::all_of(s.begin() + 1, s.end(), [](char ch) { return std::islower(static_cast<unsigned char>(ch)); }));
            CHECK(c > 0);
            CHECK(s != "E");
        }
}

TEST_CASE("thermo.inp: charge from the electron field", "[nasa]") {
    const Record& e = rec("e-");
    CHECK(e.charge == -1);
    CHECK(e.elements.empty());
    CHECK(rec("D+").charge == 1);
    CHECK(count_of(rec("D+"), "D") == 1);
    CHECK(rec("NO2-").charge == -1);
    CHECK(rec("OH+").charge == 1);
    CHECK(rec("CO2").charge == 0);
    for (const Record& r : records()) {
        // An ion's name ends in its sign before any ",isomer" suffix ("C6H12,cyclo-" is neutral).
        const std::string formula = r.name.substr(0, r.name.find(','));
        const bool plus = formula.find('+') != std::string::npos;
        const bool minus = formula.back() == '-';
        INFO(r.name);
        if (plus) CHECK(r.charge > 0);
        if (minus) CHECK(r.charge < 0);
        if (!plus && !minus) CHECK(r.charge == 0);
    }
}

TEST_CASE("thermo.inp: liquid and solid classification", "[nasa]") {
    CHECK(rec("CH4").phase == PhaseKind::gas);
    CHECK(rec("JP-10(g)").phase == PhaseKind::gas);
    CHECK(rec("H2O(L)").phase == PhaseKind::liquid);
    CHECK(rec("H2O(cr)").phase == PhaseKind::solid);
    CHECK(rec("C(gr)").phase == PhaseKind::solid);
    CHECK(rec("Fe(d)").phase == PhaseKind::solid);
    CHECK(rec("S(b)").phase == PhaseKind::solid);
    CHECK(rec("(CH2)x(cr)").phase == PhaseKind::solid);
    CHECK(rec("NH4NO3(L)").phase == PhaseKind::liquid);
    CHECK(rec("C2H5OH(L)").phase == PhaseKind::liquid);
    // Condensed reactant records without a phase tag: liquid propellants.
    for (const char* n : {"RP-1", "JP-4", "JP-5", "IRFNA"}) {
        INFO(n);
        CHECK(rec(n).phase == PhaseKind::liquid);
        CHECK(rec(n).phase_code != 0);
    }
    for (const Record& r : records()) {
        INFO(r.name);
        if (r.phase == PhaseKind::liquid)
            CHECK((r.name.find("(L)") != std::string::npos || r.name.find('(') == std::string::npos));
        if (r.phase == PhaseKind::solid) CHECK(r.name.find("(L)") == std::string::npos);
    }
}

TEST_CASE("thermo.inp: records without temperature intervals", "[nasa]") {
    const Record& ch4l = rec("CH4(L)");
    CHECK(ch4l.intervals.empty());
    CHECK(ch4l.t_single == 111.643);
    CHECK(ch4l.tmin() == 111.643);
    CHECK(ch4l.tmax() == 111.643);
    CHECK(ch4l.h298 == -89233.0);  // the assigned enthalpy at 111.643 K, J/mol
    CHECK(ch4l.phase == PhaseKind::liquid);
    CHECK(ch4l.reactant_only);
    const Record& pe = rec("(CH2)x(cr)");
    CHECK(pe.intervals.empty());
    CHECK(pe.t_single == 298.15);
    CHECK(pe.phase == PhaseKind::solid);
    CHECK(find_interval(pe, 298.15) == nullptr);
    CHECK(rec("RP-1").t_single == 298.15);
    CHECK(rec("RP-1").h298 == -24717.7);
}

TEST_CASE("thermo.inp: some condensed records start at 298.15 K", "[nasa]") {
    std::size_t n = 0;
    for (const Record& r : records())
        if (r.phase != PhaseKind::gas && !r.intervals.empty() && r.tmin() == 298.15) ++n;
    WARN(n << " condensed records start at 298.15 K");
    CHECK(n > 50);
    CHECK(rec("Fe2O3(cr)").tmin() == 298.15);
    CHECK(find_interval(rec("Fe2O3(cr)"), 250.0) == nullptr);
    CHECK(find_interval(rec("Fe2O3(cr)"), 298.15) != nullptr);
}

TEST_CASE("thermo.inp: H, Cp and S join across interval boundaries", "[nasa]") {
    // Common practice: the fitted intervals of a species are constrained to meet at their
    // boundaries. Tolerances: 10 J/mol in H (a fifth of the 0.05 kJ/mol the tables are printed
    // to), 0.2 J/(mol K) in Cp and 0.05 J/(mol K) in S. A merged record can have a real jump
    // where a transition lies between its file records.
    std::vector<std::string> h_out, cp_out, s_out;
    std::size_t boundaries = 0;
    double worst_other_h = 0;
    for (const Record& r : records())
        for (std::size_t k = 1; k < r.intervals.size(); ++k) {
            const Interval& lo = r.intervals[k - 1];
            const Interval& hi = r.intervals[k];
            const double T = hi.tmin;
            ++boundaries;
            const double dh = (h_over_RT(hi, T) - h_over_RT(lo, T)) * R_nasa * T;
            const double dcp = (cp_over_R(hi, T) - cp_over_R(lo, T)) * R_nasa;
            const double ds = (s_over_R(hi, T) - s_over_R(lo, T)) * R_nasa;
            std::ostringstream at;
            at << r.name << " at " << T << " K";
            if (std::fabs(dh) > 10) h_out.push_back(at.str() + " dH=" + std::to_string(dh));
            else worst_other_h = std::max(worst_other_h, std::fabs(dh));
            if (std::fabs(dcp) > 0.2) cp_out.push_back(at.str() + " dCp=" + std::to_string(dcp));
            if (std::fabs(ds) > 0.05) s_out.push_back(at.str() + " dS=" + std::to_string(ds));
        }
    std::ostringstream report;
    report << boundaries << " interval boundaries; beyond tolerance: H " << h_out.size() << ", Cp "
           << cp_out.size() << ", S " << s_out.size() << "; worst H mismatch within tolerance "
           << worst_other_h << " J/mol";
    for (auto* v : {&h_out, &cp_out, &s_out})
        for (auto& s : *v) report << "\n  " << s;
    WARN(report.str());
    CHECK(boundaries > 1700);
    // The known exceptions, each a property of the file (see the report):
    //   ALN(L) 2700 K: at 2700 K its 1800-2700 K interval lies exactly 68.000 kJ/mol below the
    //     2700-6000 K one (with dS = 68000/2700 J/(mol K), a step like a transition's) inside one
    //     record - the file's own values, reported, not changed.
    //   SnS(cr) 875 K: two polymorphs under one name, merged; the step is the transition enthalpy.
    //   Fe2O3(cr) 960 K, Fe3O4(cr) 850 K: Curie points between merged records (Cp peak, H joins).
    //   NaCN(II), NaCN(III): fits around the 288.5 K lambda transition meet only to 0.3 J/(mol K) in S.
    auto names = [](const std::vector<std::string>& v) {
        std::set<std::string> s;
        for (auto& x : v) s.insert(x.substr(0, x.find(" at ")));
        return s;
    };
    CHECK(names(h_out) == std::set<std::string>{"ALN(L)", "SnS(cr)"});
    CHECK(names(cp_out) == std::set<std::string>{"ALN(L)", "SnS(cr)", "Fe2O3(cr)", "Fe3O4(cr)"});
    CHECK(names(s_out) == std::set<std::string>{"ALN(L)", "SnS(cr)", "NaCN(II)", "NaCN(III)"});
}

TEST_CASE("thermo.inp: H(298.15 K) of each record equals its heat of formation", "[nasa]") {
    // TP-2002-211556: the assigned enthalpy H°(298.15) is ΔfH°(298.15), the value in the record's
    // second line. Tolerance 1 J/mol (the field is printed to 0.001 J/mol; b1 to 10 digits).
    std::size_t n = 0, bad = 0;
    double worst = 0;
    std::string worst_name;
    for (const Record& r : records()) {
        if (!find_interval(r, 298.15)) continue;
        ++n;
        const double d = std::fabs(H(r, 298.15) - r.h298);
        if (d > worst) { worst = d; worst_name = r.name; }
        if (d > 1.0) {
            ++bad;
            UNSCOPED_INFO(r.name << ": H(298.15)=" << H(r, 298.15) << " J/mol, record " << r.h298);
        }
    }
    WARN(n << " records hold 298.15 K; worst |H(298.15)-dHf| = " << worst << " J/mol (" << worst_name << ")");
    CHECK(n > 1500);
    CHECK(bad == 0);
}

TEST_CASE("closed forms agree with integrals of Cp", "[nasa]") {
    // dH/dT = Cp and dS/dT = Cp/T (thermodynamic identities); Simpson's rule over each interval.
    for (const char* name : {"CH4", "H2O", "CO2", "Fe(a)", "C8H18(L),n-octa", "AL2O3(a)"}) {
        const Record& r = rec(name);
        for (const Interval& iv : r.intervals) {
            const double t0 = iv.tmin, t1 = std::min(iv.tmax, 6000.0);
            const int n = 2000;
            const double h = (t1 - t0) / n;
            double icp = 0, icpt = 0;
            for (int i = 0; i <= n; ++i) {
                const double T = t0 + i * h;
                const double w = (i == 0 || i == n) ? 1 : (i % 2 ? 4 : 2);
                icp += w * cp_over_R(iv, T);
                icpt += w * cp_over_R(iv, T) / T;
            }
            icp *= h / 3;
            icpt *= h / 3;
            INFO(name << " " << t0 << "-" << t1);
            CHECK(h_over_RT(iv, t1) * t1 - h_over_RT(iv, t0) * t0 == Approx(icp).epsilon(1e-9).margin(1e-6));
            CHECK(s_over_R(iv, t1) - s_over_R(iv, t0) == Approx(icpt).epsilon(1e-9).margin(1e-9));
        }
    }
}

TEST_CASE("reference values at 1000 K: NIST-JANAF", "[nasa]") {
    // NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), ideal gas at 1 bar, T = 1000 K:
    // Cp° and S° in J/(mol K), H°(T)-H°(298.15) in kJ/mol. All values typed from memory.
    // Tolerances about the table's precision: 0.1 J/(mol K), 0.05 kJ/mol.
    struct Ref { const char* name; double cp, s, dh; };
    const Ref refs[] = {
        {"H2O", 41.268, 232.738, 26.000},  // from memory, JANAF water (ideal gas)
        {"CO2", 54.308, 269.299, 33.397},  // from memory, JANAF carbon dioxide
        {"N2", 32.697, 228.170, 21.463},   // from memory, JANAF nitrogen
        {"O2", 34.870, 243.578, 22.703},   // from memory, JANAF oxygen
    };
    for (const Ref& ref : refs) {
        const Record& r = rec(ref.name);
        INFO(ref.name);
        CHECK(Cp(r, 1000) == Approx(ref.cp).margin(0.1));
        CHECK(S(r, 1000) == Approx(ref.s).margin(0.1));
        CHECK((H(r, 1000) - H(r, 298.15)) / 1000 == Approx(ref.dh).margin(0.05));
    }
    // Methane: JANAF 1000 K Cp° 71.795, S° 247.549, H-H298 38.179 kJ/mol (from memory). The NASA
    // CH4 record is from Gurvich 1991 (its comment line), a later evaluation than JANAF's; the two
    // differ at 1000 K by about 1.9 J/(mol K) in Cp°, 0.8 in S° and 0.5 kJ/mol in H. Checked to
    // the size of that difference between the sources, not to table precision.
    const Record& ch4 = rec("CH4");
    CHECK(Cp(ch4, 1000) == Approx(71.795).epsilon(0.03));
    CHECK(S(ch4, 1000) == Approx(247.549).margin(1.0));
    CHECK((H(ch4, 1000) - H(ch4, 298.15)) / 1000 == Approx(38.179).margin(0.6));
    CHECK(ch4.comment.find("Gurvich,1991") != std::string::npos);
}

TEST_CASE("reference values at 298.15 K: CODATA Key Values and NIST-JANAF", "[nasa]") {
    // CODATA Key Values for Thermodynamics (Cox, Wagman & Medvedev 1989), 298.15 K, 1 bar;
    // ΔfH° in kJ/mol, S° in J/(mol K). Typed from memory. Tolerance 0.05 kJ/mol, 0.05 J/(mol K)
    // (CODATA uncertainties are 0.01-0.13 of the same units).
    struct Ref { const char* name; double dhf, s; };
    const Ref refs[] = {
        {"H2O", -241.826, 188.835},    // from memory, CODATA H2O(g)
        {"H2O(L)", -285.830, 69.95},   // from memory, CODATA H2O(l)
        {"CO2", -393.51, 213.785},     // from memory, CODATA CO2(g)
        {"CO", -110.53, 197.660},      // from memory, CODATA CO(g)
        {"N2", 0, 191.609},            // from memory, CODATA N2(g)
        {"O2", 0, 205.152},            // from memory, CODATA O2(g)
        {"H2", 0, 130.680},            // from memory, CODATA H2(g)
        {"C(gr)", 0, 5.74},            // from memory, CODATA graphite
    };
    for (const Ref& ref : refs) {
        const Record& r = rec(ref.name);
        INFO(ref.name);
        CHECK(r.h298 / 1000 == Approx(ref.dhf).margin(0.05));
        CHECK(H(r, 298.15) / 1000 == Approx(ref.dhf).margin(0.05));
        CHECK(S(r, 298.15) == Approx(ref.s).margin(0.05));
    }
    // NIST-JANAF 4th ed., Cp° at 298.15 K in J/(mol K), from memory; tolerance 0.1.
    CHECK(Cp(rec("H2O"), 298.15) == Approx(33.590).margin(0.1));
    CHECK(Cp(rec("CO2"), 298.15) == Approx(37.135).margin(0.1));
    CHECK(Cp(rec("N2"), 298.15) == Approx(29.124).margin(0.1));
    CHECK(Cp(rec("O2"), 298.15) == Approx(29.376).margin(0.1));
}

TEST_CASE("thermo.inp: record molar mass equals the sum of standard atomic weights", "[nasa]") {
    // Outside source: the molecular weights printed in the NASA/TP-2002-211556 records, against
    // data/elements.csv (IUPAC/CIAAW). The record weights use older atomic weights (e.g. S 32.065,
    // C 12.0107), so agreement is to about 2e-4 relative, not exact.
    const auto elements = parse_elements_csv(embedded_elements_csv());
    std::map<std::string, double> w;
    for (const Element& e : elements) w[e.symbol] = e.weight;
    const double electron = 5.48579909e-4;  // g/mol, CODATA electron molar mass, from memory
    double worst = 0;
    std::string worst_name;
    std::vector<std::string> unknown;
    for (const Record& r : records()) {
        double m = -r.charge * electron;
        bool known = true;
        for (auto& [s, c] : r.elements) {
            if (!w.count(s)) { known = false; break; }
            m += w[s] * c;
        }
        if (!known) { unknown.push_back(r.name); continue; }
        const double rel = std::fabs(m - r.molar_mass) / r.molar_mass;
        INFO(r.name << ": record " << r.molar_mass << ", elements.csv " << m);
        CHECK(rel < 2.5e-4);
        if (rel > worst) { worst = rel; worst_name = r.name; }
    }
    WARN("worst relative molar-mass difference " << worst << " (" << worst_name << ")");
    // "UA" is the file's dummy for undissociated NH3, with the made-up element symbol "UA".
    CHECK(unknown == std::vector<std::string>{"UA"});
}

TEST_CASE("malformed NASA text: errors name the line", "[nasa]") {
    const std::string good = syn_record("CO2", {{200, 1000}, {1000, 6000}});
    REQUIRE(parse_nasa_glenn(syn_file(good)).size() == 1);
    CHECK(parse_nasa_glenn(syn_file(good))[0].intervals[1].a[2] == 3.5);

    expect_error("! only a comment\n", 2, "no line 'thermo'");
    expect_error("! x\nthermx\n", 2, "expected the line 'thermo'");
    expect_error("thermo\n", 2, "ends after 'thermo'");
    expect_error(syn_header + good + "END PRODUCTS\n", 14, "without the line 'END REACTANTS'");
    expect_error(syn_file(""), 7, "no species records");

    auto with_line = [&](std::size_t line, const std::string& replacement) {  // line of syn_file(good)
        std::string t = syn_file(good);
        std::istringstream in(t);
        std::string l, out;
        for (std::size_t n = 1; std::getline(in, l); ++n) out += (n == line ? replacement : l) + "\n";
        return out;
    };
    const std::string l6 = " 2 g 1/01 C   1.00O   2.00    0.00    0.00    0.00 0   44.0095000    -393510.000";
    expect_error(with_line(6, "xx" + l6.substr(2)), 6, "number of temperature intervals");
    expect_error(with_line(6, l6.substr(0, 52) + "   abc       " + l6.substr(65)), 6, "molecular weight");
    expect_error(with_line(6, l6.substr(0, 66)), 6, "heat of formation");
    expect_error(with_line(6, l6.substr(0, 18) + "    1.00" + l6.substr(26)), 6, "no element symbol");
    expect_error(with_line(6, l6.substr(0, 12) + " -1.00" + l6.substr(18)), 6, "negative count");
    expect_error(with_line(6, l6.substr(0, 18) + "E    .50" + l6.substr(26)), 6, "not a whole number");
    const std::string l7 = "    200.000   1000.0007 -2.0 -1.0  0.0  1.0  2.0  3.0  4.0  0.0         9000.000";
    expect_error(with_line(7, l7.substr(0, 22) + "8" + l7.substr(23)), 7, "expected 7 coefficients");
    expect_error(with_line(7, l7.substr(0, 23) + " -1.0" + l7.substr(28)), 7, "exponents -2 -1 0 1 2 3 4 0");
    expect_error(with_line(7, "   1200.000" + l7.substr(11)), 7, "empty or not positive");
    expect_error(with_line(8, std::string(16, ' ') + dnum(0) + dnum(3.5) + dnum(0) + dnum(0)), 8, "a coefficient");
    expect_error(with_line(8, " 0.000000000X+00" + dnum(0) + dnum(3.5) + dnum(0) + dnum(0)), 8, "a coefficient");
    expect_error(with_line(9, dnum(0) + dnum(0) + dnum(1.0) + dnum(0) + dnum(0)), 9, "columns 33-48");
    // An explicit zero in columns 33-48 is accepted (the file has it).
    CHECK_NOTHROW(parse_nasa_glenn(with_line(9, dnum(0) + dnum(0) + dnum(0.0) + dnum(0) + dnum(0))));
    expect_error(with_line(9, dnum(0) + dnum(0) + std::string(16, ' ') + "   garbage      " + dnum(0)), 9, "b1");
    expect_error(with_line(10, "    900.000   6000.0007 -2.0 -1.0  0.0  1.0  2.0  3.0  4.0  0.0         9000.000"),
                 10, "starts at 900 K but the previous one ends at 1000 K");
    // The text ends inside a record.
    std::string cut = syn_header + good;
    cut = cut.substr(0, cut.rfind("\n", cut.size() - 2) + 1);  // drop the last line
    expect_error(cut, 12, "ends inside the record 'CO2' of line 5");
    // A record without intervals needs its temperature line.
    const std::string zero = syn_record("X(L)", {}, "C   1.00    0.00    0.00    0.00    0.00", 1, 12.011, 0);
    auto rz = parse_nasa_glenn(syn_file("", zero + "    298.150      0.0000  0.0  0.0  0.0  0.0  0.0  0.0  0.0  0.0            0.000\n"));
    REQUIRE(rz.size() == 1);
    CHECK(rz[0].t_single == 298.15);
    CHECK(rz[0].reactant_only);
    CHECK(rz[0].phase == PhaseKind::liquid);
    expect_error(syn_file("", zero + "    garbage\n"), 8, "the temperature");
    // CRLF line ends, as in the shipped file, read the same.
    std::string crlf;
    for (char c : syn_file(good)) {
        if (c == '\n') crlf += '\r';
        crlf += c;
    }
    CHECK(parse_nasa_glenn(crlf)[0].intervals.size() == 2);
}

TEST_CASE("thermo.inp: data-set facts", "[nasa]") {
    // Every interval has the exponents -2..4, 0 (checked while parsing); every record holds a
    // reference-date code; the provenance line names the Debian package.
    for (const Record& r : records()) {
        INFO(r.name);
        CHECK(!r.date_code.empty());
    }
    CHECK(embedded_nasa_provenance().find("rocketcea") != std::string_view::npos);
    CHECK(rec("e-").date_code == "g12/98");
    CHECK(rec("CH4").comment == "Gurvich,1991 pt1 p44 pt2 p36.");
}
