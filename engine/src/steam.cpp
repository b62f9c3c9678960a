// Water and steam by IAPWS-IF97 (steam.hpp): the equations of regions 1, 2 and 4 and the B23
// boundary, typed from the release IAPWS R7-97(2012); then the Engine's steam functions, which
// decide the region and refuse every state outside regions 1, 2 and 4 in words.
#include "steam.hpp"

#include <cmath>
#include <cstddef>
#include <string>

namespace rxnheat::steam {

namespace {

// ---- region 1: the dimensionless Gibbs free energy γ(π, τ) (release, table 2) --------------------
// γ = Σ nᵢ (7.1 − π)^Iᵢ (τ − 1.222)^Jᵢ, π = p/16.53 MPa, τ = 1386 K/T.
struct Term {
    int I, J;
    double n;
};
constexpr double p_star1_MPa = 16.53;
constexpr double T_star1_K = 1386.0;
constexpr Term region1_terms[34] = {
    {0, -2, 0.14632971213167},        {0, -1, -0.84548187169114},       {0, 0, -0.37563603672040e1},
    {0, 1, 0.33855169168385e1},       {0, 2, -0.95791963387872},        {0, 3, 0.15772038513228},
    {0, 4, -0.16616417199501e-1},     {0, 5, 0.81214629983568e-3},      {1, -9, 0.28319080123804e-3},
    {1, -7, -0.60706301565874e-3},    {1, -1, -0.18990068218419e-1},    {1, 0, -0.32529748770505e-1},
    {1, 1, -0.21841717175414e-1},     {1, 3, -0.52838357969930e-4},     {2, -3, -0.47184321073267e-3},
    {2, 0, -0.30001780793026e-3},     {2, 1, 0.47661393906987e-4},      {2, 3, -0.44141845330846e-5},
    {2, 17, -0.72694996297594e-15},   {3, -4, -0.31679644845054e-4},    {3, 0, -0.28270797985312e-5},
    {3, 6, -0.85205128120103e-9},     {4, -5, -0.22425281908000e-5},    {4, -2, -0.65171222895601e-6},
    {4, 10, -0.14341729937924e-12},   {5, -8, -0.40516996860117e-6},    {8, -11, -0.12734301741641e-8},
    {8, -6, -0.17424871230634e-9},    {21, -29, -0.68762131295531e-18}, {23, -31, 0.14478307828521e-19},
    {29, -38, 0.26335781662795e-22},  {30, -39, -0.11947622640071e-22}, {31, -40, 0.18228094581404e-23},
    {32, -41, -0.93537087292458e-25},
};

// ---- region 2 (release, tables 10 and 11) ---------------------------------------------------------
// γ = γ° + γʳ, π = p/1 MPa, τ = 540 K/T; γ° = ln π + Σ n°ᵢ τ^J°ᵢ; γʳ = Σ nᵢ π^Iᵢ (τ − 0.5)^Jᵢ.
constexpr double p_star2_MPa = 1.0;
constexpr double T_star2_K = 540.0;
struct IdealTerm {
    int J;
    double n;
};
constexpr IdealTerm region2_ideal_terms[9] = {
    {0, -0.96927686500217e1},  {1, 0.10086655968018e2}, {-5, -0.56087911283020e-2},
    {-4, 0.71452738081455e-1}, {-3, -0.40710498223928}, {-2, 0.14240819171444e1},
    {-1, -0.43839511319450e1}, {2, -0.28408632460772},  {3, 0.21268463753307e-1},
};
constexpr Term region2_residual_terms[43] = {
    {1, 0, -0.17731742473213e-2},    {1, 1, -0.17834862292358e-1},    {1, 2, -0.45996013696365e-1},
    {1, 3, -0.57581259083432e-1},    {1, 6, -0.50325278727930e-1},    {2, 1, -0.33032641670203e-4},
    {2, 2, -0.18948987516315e-3},    {2, 4, -0.39392777243355e-2},    {2, 7, -0.43797295650573e-1},
    {2, 36, -0.26674547914087e-4},   {3, 0, 0.20481737692309e-7},     {3, 1, 0.43870667284435e-6},
    {3, 3, -0.32277677238570e-4},    {3, 6, -0.15033924542148e-2},    {3, 35, -0.40668253562649e-1},
    {4, 1, -0.78847309559367e-9},    {4, 2, 0.12790717852285e-7},     {4, 3, 0.48225372718507e-6},
    {5, 7, 0.22922076337661e-5},     {6, 3, -0.16714766451061e-10},   {6, 16, -0.21171472321355e-2},
    {6, 35, -0.23895741934104e2},    {7, 0, -0.59059564324270e-17},   {7, 11, -0.12621808899101e-5},
    {7, 25, -0.38946842435739e-1},   {8, 8, 0.11256211360459e-10},    {8, 36, -0.82311340897998e1},
    {9, 13, 0.19809712802088e-7},    {10, 4, 0.10406965210174e-18},   {10, 10, -0.10234747095929e-12},
    {10, 14, -0.10018179379511e-8},  {16, 29, -0.80882908646985e-10}, {16, 50, 0.10693031879409},
    {18, 57, -0.33662250574171},     {20, 20, 0.89185845355421e-24},  {20, 35, 0.30629316876232e-12},
    {20, 48, -0.42002467698208e-5},  {21, 21, -0.59056029685639e-25}, {22, 53, 0.37826947613457e-5},
    {23, 39, -0.12768608934681e-14}, {24, 26, 0.73087610595061e-28},  {24, 40, 0.55414715350778e-16},
    {24, 58, -0.94369707241210e-6},
};

// ---- region 4 (release, table 34) and B23 (table 1) ------------------------------------------------
constexpr double n4[11] = {0,  // n4[1] .. n4[10], numbered as in the release
                           0.11670521452767e4,
                           -0.72421316703206e6,
                           -0.17073846940092e2,
                           0.12020824702470e5,
                           -0.32325550322333e7,
                           0.14915108613530e2,
                           -0.48232657361591e4,
                           0.40511340542057e6,
                           -0.23855557567849,
                           0.65017534844798e3};
constexpr double nB23[6] = {
    0, 0.34805185628969e3, -0.11671859879975e1, 0.10192970039326e-2, 0.57254459862746e3, 0.13918839778870e2};

/// x^k for a whole k (negative too); x^0 = 1 even for x = 0.
double ipow(double x, int k) noexcept { return k == 0 ? 1.0 : std::pow(x, k); }

/// A Gibbs function and its derivatives in π and τ.
struct Gibbs {
    double g = 0, g_p = 0, g_pp = 0, g_t = 0, g_tt = 0, g_pt = 0;
};

}  // namespace

State region1(double p_MPa, double T_K) noexcept {
    const double pi = p_MPa / p_star1_MPa, tau = T_star1_K / T_K;
    const double a = 7.1 - pi, b = tau - 1.222;
    Gibbs d;
    for (const Term& t : region1_terms) {
        const double ai = ipow(a, t.I), bj = ipow(b, t.J);
        const double ai1 = t.I == 0 ? 0.0 : t.I * ipow(a, t.I - 1);
        const double ai2 = t.I <= 1 ? 0.0 : t.I * (t.I - 1) * ipow(a, t.I - 2);
        const double bj1 = t.J == 0 ? 0.0 : t.J * ipow(b, t.J - 1);
        const double bj2 = (t.J == 0 || t.J == 1) ? 0.0 : t.J * (t.J - 1) * ipow(b, t.J - 2);
        d.g += t.n * ai * bj;
        d.g_p -= t.n * ai1 * bj;  // d/dπ of (7.1 − π)^I is −I (7.1 − π)^(I−1)
        d.g_pp += t.n * ai2 * bj;
        d.g_t += t.n * ai * bj1;
        d.g_tt += t.n * ai * bj2;
        d.g_pt -= t.n * ai1 * bj1;
    }
    const double RT = R_kJ_per_kgK * T_K;  // kJ/kg
    State s;
    s.v_m3_per_kg = RT * pi * d.g_p / (p_MPa * 1000.0);  // kJ/kg over kPa is m³/kg
    s.h_kJ_per_kg = RT * tau * d.g_t;
    s.u_kJ_per_kg = RT * (tau * d.g_t - pi * d.g_p);
    s.s_kJ_per_kgK = R_kJ_per_kgK * (tau * d.g_t - d.g);
    s.cp_kJ_per_kgK = -R_kJ_per_kgK * tau * tau * d.g_tt;
    const double x = d.g_p - tau * d.g_pt;
    s.w_m_per_s = std::sqrt(1000.0 * RT * d.g_p * d.g_p / (x * x / (tau * tau * d.g_tt) - d.g_pp));
    return s;
}

State region2(double p_MPa, double T_K) noexcept {
    const double pi = p_MPa / p_star2_MPa, tau = T_star2_K / T_K;
    double g0 = std::log(pi), g0_t = 0, g0_tt = 0;
    for (const IdealTerm& t : region2_ideal_terms) {
        g0 += t.n * ipow(tau, t.J);
        if (t.J != 0) g0_t += t.n * t.J * ipow(tau, t.J - 1);
        if (t.J != 0 && t.J != 1) g0_tt += t.n * t.J * (t.J - 1) * ipow(tau, t.J - 2);
    }
    const double g0_p = 1.0 / pi;
    const double b = tau - 0.5;
    Gibbs r;
    for (const Term& t : region2_residual_terms) {  // every I >= 1
        const double pI = ipow(pi, t.I), pI1 = t.I * ipow(pi, t.I - 1);
        const double pI2 = t.I == 1 ? 0.0 : t.I * (t.I - 1) * ipow(pi, t.I - 2);
        const double bj = ipow(b, t.J), bj1 = t.J == 0 ? 0.0 : t.J * ipow(b, t.J - 1);
        const double bj2 = (t.J == 0 || t.J == 1) ? 0.0 : t.J * (t.J - 1) * ipow(b, t.J - 2);
        r.g += t.n * pI * bj;
        r.g_p += t.n * pI1 * bj;
        r.g_pp += t.n * pI2 * bj;
        r.g_t += t.n * pI * bj1;
        r.g_tt += t.n * pI * bj2;
        r.g_pt += t.n * pI1 * bj1;
    }
    const double RT = R_kJ_per_kgK * T_K;
    State s;
    s.v_m3_per_kg = RT * pi * (g0_p + r.g_p) / (p_MPa * 1000.0);
    s.h_kJ_per_kg = RT * tau * (g0_t + r.g_t);
    s.u_kJ_per_kg = RT * (tau * (g0_t + r.g_t) - pi * (g0_p + r.g_p));
    s.s_kJ_per_kgK = R_kJ_per_kgK * (tau * (g0_t + r.g_t) - (g0 + r.g));
    s.cp_kJ_per_kgK = -R_kJ_per_kgK * tau * tau * (g0_tt + r.g_tt);
    // Release, table 12: w² = RT (1 + 2πγʳ_π + π²γʳ_π²) / ((1 − π²γʳ_ππ) + (1 + πγʳ_π − τπγʳ_πτ)²/(τ²(γ°_ττ +
    // γʳ_ττ))).
    const double num = 1.0 + 2.0 * pi * r.g_p + pi * pi * r.g_p * r.g_p;
    const double y = 1.0 + pi * r.g_p - tau * pi * r.g_pt;
    const double den = (1.0 - pi * pi * r.g_pp) + y * y / (tau * tau * (g0_tt + r.g_tt));
    s.w_m_per_s = std::sqrt(1000.0 * RT * num / den);
    return s;
}

double saturation_pressure_MPa(double T_K) noexcept {
    // Release, eqs. 29a and 30 (T* = 1 K, p* = 1 MPa).
    const double theta = T_K + n4[9] / (T_K - n4[10]);
    const double A = theta * theta + n4[1] * theta + n4[2];
    const double B = n4[3] * theta * theta + n4[4] * theta + n4[5];
    const double C = n4[6] * theta * theta + n4[7] * theta + n4[8];
    const double q = 2.0 * C / (-B + std::sqrt(B * B - 4.0 * A * C));
    return q * q * q * q;
}

double saturation_temperature_K(double p_MPa) noexcept {
    // Release, eqs. 29b and 31.
    const double beta = std::sqrt(std::sqrt(p_MPa));
    const double E = beta * beta + n4[3] * beta + n4[6];
    const double F = n4[1] * beta * beta + n4[4] * beta + n4[7];
    const double G = n4[2] * beta * beta + n4[5] * beta + n4[8];
    const double D = 2.0 * G / (-F - std::sqrt(F * F - 4.0 * E * G));
    const double m = n4[10] + D;
    return (m - std::sqrt(m * m - 4.0 * (n4[9] + n4[10] * D))) / 2.0;
}

double b23_pressure_MPa(double T_K) noexcept { return nB23[1] + nB23[2] * T_K + nB23[3] * T_K * T_K; }
double b23_temperature_K(double p_MPa) noexcept { return nB23[4] + std::sqrt((p_MPa - nB23[5]) / nB23[3]); }

Region region_of(double p_MPa, double T_K) noexcept {
    if (!(p_MPa > 0) || !(T_K >= T_min_K) || T_K > T_region5_max_K) return Region::outside;
    if (T_K > T_region2_max_K) return p_MPa <= p_region5_max_MPa ? Region::five : Region::outside;
    if (p_MPa > p_max_MPa) return Region::outside;
    if (T_K <= T_13_K) {
        const double ps = saturation_pressure_MPa(T_K);
        if (std::fabs(p_MPa - ps) <= 1e-9 * ps) return Region::four;
        return p_MPa > ps ? Region::one : Region::two;
    }
    if (T_K <= T_B23_max_K) return p_MPa <= b23_pressure_MPa(T_K) ? Region::two : Region::three;
    return Region::two;
}

SaturatedState parse_saturated_state(std::string_view text) {
    const std::string_view t = trim(text);
    auto is = [&](std::string_view word) {
        if (t.size() != word.size()) return false;
        for (std::size_t i = 0; i < t.size(); ++i) {
            char c = t[i];
            if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
            if (c != word[i]) return false;
        }
        return true;
    };
    if (is("liquid")) return SaturatedState::liquid;
    if (is("vapour")) return SaturatedState::vapour;
    throw Error(ErrorKind::argument,
                "'state' must be \"liquid\" or \"vapour\" (the saturated liquid or vapour at the "
                "pressure), not '" +
                    std::string(t) +
                    "'; leave it empty for compressed liquid "
                    "or superheated vapour at the temperature given");
}

}  // namespace rxnheat::steam

// ---- the Engine's steam functions ---------------------------------------------------------------
namespace rxnheat {

namespace {

using namespace steam;

constexpr double MPa_per_bar = 0.1;

std::string bar_words(double p_MPa) { return number_words(p_MPa / MPa_per_bar) + " bar"; }
std::string kelvin_words(double T_K) {
    return number_words(T_K) + " K (" + number_words(T_K - 273.15) + " °C)";
}
const char* const implemented =
    "rxnheat implements IAPWS-IF97 regions 1 (compressed liquid), 2 (vapour) and 4 (saturation) only";

[[noreturn]] void out_of_range(const std::string& what) { throw Error(ErrorKind::out_of_range, what); }

double pressure_MPa(double pressure_bar) {
    if (!std::isfinite(pressure_bar)) throw Error(ErrorKind::argument, "the pressure is not a finite number");
    if (!(pressure_bar > 0))
        throw Error(ErrorKind::argument,
                    "the pressure must be above zero absolute, not " + number_words(pressure_bar) + " bar");
    return pressure_bar * MPa_per_bar;
}
void check_temperature(double T_K) {
    if (!std::isfinite(T_K)) throw Error(ErrorKind::argument, "the temperature is not a finite number");
}

/// The saturation temperature at p, for a pressure on IF97's saturation line (else in words).
double saturation_T_checked(double p_MPa) {
    const double p_low = saturation_pressure_MPa(T_min_K);  // 611.213 Pa
    if (p_MPa < p_low)
        out_of_range("the saturation temperature at " + bar_words(p_MPa) +
                     " is below 273.15 K, the lower limit of "
                     "IAPWS-IF97 (its saturation line starts at " +
                     bar_words(p_low) +
                     ", the saturation pressure at "
                     "273.15 K)");
    if (p_MPa > p_critical_MPa)
        out_of_range(bar_words(p_MPa) +
                     " is above the critical pressure of water, 220.64 bar (22.064 MPa): there is "
                     "no saturation, liquid and vapour are no longer distinct");
    const double T = saturation_temperature_K(p_MPa);
    return T < T_min_K ? T_min_K : T > T_critical_K ? T_critical_K : T;  // round-off at the two ends
}

/// h of the saturated liquid or vapour at p (regions 1 and 2 on the saturation line).
double saturated_h(double p_MPa, SaturatedState state, const char* what) {
    const double T = saturation_T_checked(p_MPa);
    if (T > T_13_K)
        out_of_range(
            std::string(what) + " at " + bar_words(p_MPa) + " (saturation at " + kelvin_words(T) +
            ") lies in region 3 of IAPWS-IF97, near the critical point: the saturated states above " +
            bar_words(saturation_pressure_MPa(T_13_K)) + " (623.15 K) belong to region 3; " + implemented);
    return state == SaturatedState::liquid ? region1(p_MPa, T).h_kJ_per_kg : region2(p_MPa, T).h_kJ_per_kg;
}

}  // namespace

double Engine::steam_tsat(double pressure_bar) { return saturation_T_checked(pressure_MPa(pressure_bar)); }

double Engine::steam_psat(double temperature_K) {
    check_temperature(temperature_K);
    if (temperature_K < T_min_K)
        out_of_range(kelvin_words(temperature_K) +
                     " is below 273.15 K (0 °C), the lower limit of IAPWS-IF97's "
                     "saturation line (ice is not covered)");
    if (temperature_K > T_critical_K)
        out_of_range(
            kelvin_words(temperature_K) +
            " is above the critical temperature of water, 647.096 K "
            "(373.946 °C): there is no saturation pressure, liquid and vapour are no longer distinct");
    return saturation_pressure_MPa(temperature_K) / MPa_per_bar;
}

double Engine::steam_h(double pressure_bar, double temperature_K) {
    const double p = pressure_MPa(pressure_bar);
    check_temperature(temperature_K);
    const double T = temperature_K;
    const std::string at = bar_words(p) + " and " + kelvin_words(T);
    switch (region_of(p, T)) {
    case Region::one: return region1(p, T).h_kJ_per_kg;
    case Region::two: return region2(p, T).h_kJ_per_kg;
    case Region::four:
        throw Error(ErrorKind::argument,
                    at + " is on the saturation line (the saturation pressure at this temperature is " +
                        bar_words(saturation_pressure_MPa(T)) +
                        "), where liquid and vapour coexist: give the state "
                        "\"liquid\" or \"vapour\" for the saturated liquid or vapour at the pressure");
    case Region::three:
        out_of_range(at +
                     " lie in region 3 of IAPWS-IF97, near the critical point (above 623.15 K and above the "
                     "B23 boundary, here " +
                     bar_words(b23_pressure_MPa(T)) + "); " + implemented);
    case Region::five:
        out_of_range(at + " lie in region 5 of IAPWS-IF97 (steam above 1073.15 K, up to 500 bar); " +
                     implemented);
    case Region::outside: break;
    }
    if (T < T_min_K)
        out_of_range(at + ": below 273.15 K (0 °C), the lower limit of IAPWS-IF97 (ice is not covered)");
    if (T > T_region5_max_K) out_of_range(at + ": above 2273.15 K, the upper limit of IAPWS-IF97");
    if (T > T_region2_max_K)
        out_of_range(at + ": above 500 bar (50 MPa) at over 1073.15 K, outside IAPWS-IF97");
    out_of_range(at + ": above 1000 bar (100 MPa), the upper limit of IAPWS-IF97");
}

double Engine::steam_h(double pressure_bar, SaturatedState state) {
    return saturated_h(pressure_MPa(pressure_bar), state,
                       state == SaturatedState::liquid ? "the saturated liquid" : "the saturated vapour");
}

double Engine::steam_latent(double pressure_bar) {
    const double p = pressure_MPa(pressure_bar);
    const double h_liquid = saturated_h(p, SaturatedState::liquid, "the latent heat");
    return saturated_h(p, SaturatedState::vapour, "the latent heat") - h_liquid;
}

}  // namespace rxnheat
