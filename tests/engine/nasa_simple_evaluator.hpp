// A second, deliberately simple evaluator of the NASA Glenn coefficient file
// (data/nasa-glenn/thermo.inp, McBride, Zehe & Gordon, NASA/TP-2002-211556, 2002) for the
// reference tests (test_reference_reactions.cpp, test_equilibrium_thermo.cpp). It shares no code
// with the engine: each record is found by its exact name and its intervals are read by fixed
// columns.
#pragma once

#include <cmath>
#include <fstream>
#include <map>
#include <sstream>
#include <stdexcept>
#include <string>
#include <vector>

namespace rxnheat_test {

// ----------------------------------------------------------------------------------------------
// The independent evaluator. Shares no code with the engine.
// ----------------------------------------------------------------------------------------------
class SimpleThermoFile {
public:
    explicit SimpleThermoFile(const std::string& path) {
        std::ifstream in(path);
        if (!in) throw std::runtime_error("cannot open " + path);
        std::string line;
        while (std::getline(in, line)) lines_.push_back(line);
    }

    /// Assigned enthalpy H°(T) in J/mol of the record(s) named exactly `name` (several records
    /// with one name are consecutive pieces of one species, e.g. below/above a Curie point).
    double H(const std::string& name, double T) const {
        const auto& iv = intervals(name);
        for (const auto& i : iv) {
            if (T >= i.tlo && T <= i.thi) {
                const double* a = i.a;
                const double h_over_RT = -a[0] / (T * T) + a[1] * std::log(T) / T + a[2] + a[3] * T / 2 +
                                         a[4] * T * T / 3 + a[5] * T * T * T / 4 + a[6] * T * T * T * T / 5 +
                                         i.b1 / T;
                return 8.314510 * T * h_over_RT;
            }
        }
        throw std::runtime_error("record " + name + " has no interval holding T = " + std::to_string(T));
    }

    /// Standard entropy S°(T) in J/(mol·K) of the record(s) named exactly `name`:
    /// S°/R = −a1/(2T²) − a2/T + a3·lnT + a4·T + a5·T²/2 + a6·T³/3 + a7·T⁴/4 + b2
    /// (NASA/TP-2002-211556, the 9-term form), R = 8.314510 J/(mol·K).
    double S(const std::string& name, double T) const {
        for (const auto& i : intervals(name)) {
            if (T >= i.tlo && T <= i.thi) {
                const double* a = i.a;
                const double s_over_R = -a[0] / (2 * T * T) - a[1] / T + a[2] * std::log(T) + a[3] * T +
                                        a[4] * T * T / 2 + a[5] * T * T * T / 3 + a[6] * T * T * T * T / 4 + i.b2;
                return 8.314510 * s_over_R;
            }
        }
        throw std::runtime_error("record " + name + " has no interval holding T = " + std::to_string(T));
    }

private:
    struct Interval {
        double tlo = 0, thi = 0;
        double a[7] = {};
        double b1 = 0, b2 = 0;
    };
    std::vector<std::string> lines_;
    mutable std::map<std::string, std::vector<Interval>> cache_;

    static double field(const std::string& line, std::size_t col, std::size_t width) {
        if (line.size() < col + width) throw std::runtime_error("short line: " + line);
        std::string s = line.substr(col, width);
        for (char& c : s)
            if (c == 'D' || c == 'd') c = 'E';
        return std::stod(s);
    }

    const std::vector<Interval>& intervals(const std::string& name) const {
        auto it = cache_.find(name);
        if (it != cache_.end()) return it->second;
        std::vector<Interval> out;
        for (std::size_t k = 0; k + 1 < lines_.size(); ++k) {
            const std::string& l = lines_[k];
            if (l.empty() || l[0] == ' ' || l[0] == '!') continue;
            std::istringstream first(l);
            std::string token;
            first >> token;
            if (token != name) continue;
            const int n = std::stoi(lines_[k + 1].substr(0, 2));
            for (int j = 0; j < n; ++j) {
                const std::string& a = lines_.at(k + 2 + 3 * j);
                const std::string& b = lines_.at(k + 3 + 3 * j);
                const std::string& c = lines_.at(k + 4 + 3 * j);
                if (a.substr(22, 41) != "7 -2.0 -1.0  0.0  1.0  2.0  3.0  4.0  0.0")
                    throw std::runtime_error("unexpected exponents in " + name + ": " + a);
                Interval i;
                i.tlo = field(a, 0, 11);
                i.thi = field(a, 11, 11);
                for (int m = 0; m < 5; ++m) i.a[m] = field(b, 16 * m, 16);
                i.a[5] = field(c, 0, 16);
                i.a[6] = field(c, 16, 16);
                i.b1 = field(c, 48, 16);
                i.b2 = field(c, 64, 16);
                out.push_back(i);
            }
        }
        if (out.empty()) throw std::runtime_error("no record named " + name);
        return cache_.emplace(name, out).first->second;
    }
};

inline const SimpleThermoFile& thermo_file() {
    static const SimpleThermoFile f(std::string(RXNHEAT_SOURCE_DIR) + "/data/nasa-glenn/thermo.inp");
    return f;
}

}  // namespace rxnheat_test
