// Internal: "did you mean" hints for unknown names.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace libcoil::detail {

bool equal_ignoring_case(std::string_view a, std::string_view b);
// "; did you mean \"pitch\"?" when a candidate is close enough, else "".
std::string did_you_mean(std::string_view word, const std::vector<std::string>& candidates);
std::string join(const std::vector<std::string>& items, std::string_view sep = ", ");

}  // namespace libcoil::detail
