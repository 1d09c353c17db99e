# Expected values for test/terms/term-reliability.test.ts.
# Run from this folder:  Rscript make-expected.R
# Needs Debian r-base-core and r-cran-psych.
#
# term-counts.csv: an invented matrix of term counts (40 entries x 6 terms of a worry list),
# made with a seeded generator for this test; no real persons.
# Writes expected-term-reliability.csv:
#   raw_alpha, std_alpha  psych::alpha (Revelle), terms as items over entries
#   half_r                Pearson r of the two half sums, terms ranked by total count
#                          (ties by column order) and dealt alternately: ranks 1,3,5 | 2,4,6
#   split_half            Spearman-Brown step-up 2r/(1+r)
suppressPackageStartupMessages(library(psych))
x <- read.csv("term-counts.csv")
al <- psych::alpha(x, check.keys = FALSE, warnings = FALSE)
k <- ncol(x)
o <- order(-colSums(x), seq_len(k))
a <- o[seq(1, k, by = 2)]
b <- o[seq(2, k, by = 2)]
r <- cor(rowSums(x[, a, drop = FALSE]), rowSums(x[, b, drop = FALSE]))
out <- data.frame(
  quantity = c("raw_alpha", "std_alpha", "half_r", "split_half"),
  value = sprintf("%.12g", c(al$total$raw_alpha, al$total$std.alpha, r, 2 * r / (1 + r)))
)
write.csv(out, "expected-term-reliability.csv", row.names = FALSE, quote = FALSE)
writeLines(c(paste("R", R.version$major, R.version$minor), paste("psych", packageVersion("psych"))), "versions.txt")
