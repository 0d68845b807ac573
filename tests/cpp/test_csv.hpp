// Reading the reference tables that Python's csv module writes, for the tests of the
// private-information models (tests/reference/private/).
#ifndef CTO_TEST_CSV_HPP
#define CTO_TEST_CSV_HPP

#include <fstream>
#include <sstream>
#include <string>
#include <vector>

namespace cto_test {

// Rows of a CSV written by Python's csv module (the last field, the source, may be quoted
// and is not needed: fields are split on commas up to the known count).
inline std::vector<std::vector<std::string>> read_csv(const std::string &path,
                                                      std::vector<std::string> *head) {
    std::ifstream in(path);
    std::vector<std::vector<std::string>> rows;
    std::string line;
    bool first = true;
    while (std::getline(in, line)) {
        std::vector<std::string> f;
        std::stringstream ss(line);
        std::string cell;
        while (std::getline(ss, cell, ',')) f.push_back(cell);
        if (first) *head = f;
        else rows.push_back(f);
        first = false;
    }
    return rows;
}

}  // namespace cto_test

#endif  // CTO_TEST_CSV_HPP
