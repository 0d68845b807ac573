// Reading the reference tables that Python's csv module writes (tests/reference/): one
// record split into its fields, and the rows of the private-information tables.
#ifndef CTO_TEST_CSV_HPP
#define CTO_TEST_CSV_HPP

#include <fstream>
#include <string>
#include <vector>

namespace cto_test {

// One CSV record; fields may be double-quoted (with "" for a quote), as Python's csv
// module writes them.
inline std::vector<std::string> split_csv(const std::string &line) {
    std::vector<std::string> f;
    std::string cur;
    bool quoted = false;
    for (size_t i = 0; i < line.size(); ++i) {
        const char c = line[i];
        if (quoted) {
            if (c == '"') {
                if (i + 1 < line.size() && line[i + 1] == '"') {
                    cur += '"';
                    ++i;
                } else {
                    quoted = false;
                }
            } else {
                cur += c;
            }
        } else if (c == '"') {
            quoted = true;
        } else if (c == ',') {
            f.push_back(cur);
            cur.clear();
        } else if (c != '\r') {
            cur += c;
        }
    }
    f.push_back(cur);
    return f;
}

// The header (into *head) and the rows of a CSV written by Python's csv module.
inline std::vector<std::vector<std::string>> read_csv(const std::string &path,
                                                      std::vector<std::string> *head) {
    std::ifstream in(path);
    std::vector<std::vector<std::string>> rows;
    std::string line;
    bool first = true;
    while (std::getline(in, line)) {
        std::vector<std::string> f = split_csv(line);
        if (first) *head = f;
        else rows.push_back(f);
        first = false;
    }
    return rows;
}

}  // namespace cto_test

#endif  // CTO_TEST_CSV_HPP
