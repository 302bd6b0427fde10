// Did-you-mean help for error messages: the Levenshtein edit distance and the closest of
// a list of known words.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

namespace vibtherm {

enum class LetterCase { sensitive, ignored };

// Levenshtein distance (insertions, deletions, substitutions; V. I. Levenshtein 1966).
std::size_t edit_distance(std::string_view a, std::string_view b,
                          LetterCase letter_case = LetterCase::sensitive);

// The candidate closest to `word` within a third of its length (at least 2 edits), or "".
std::string closest_word(std::string_view word, const std::vector<std::string>& candidates);

}  // namespace vibtherm
