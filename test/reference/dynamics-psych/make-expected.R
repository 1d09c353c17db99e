# Expected values for test/dynamics/person-variable-summary.test.ts.
# Run with `Rscript make-expected.R` inside this folder (Debian r-cran-lme4, r-cran-psych).
# Writes sleepstudy.csv (lme4's sleepstudy: Belenky et al. 2003, 18 subjects x 10 days) and
# expected.csv: per subject psych::mssd, psych::autoR (autoR and rssd) and R's acf at lag 1.
library(lme4)
library(psych)
data(sleepstudy, package = "lme4")
write.csv(sleepstudy[, c("Subject", "Days", "Reaction")], "sleepstudy.csv", row.names = FALSE, quote = FALSE)
rows <- lapply(split(sleepstudy, sleepstudy$Subject, drop = TRUE), function(d) {
  d <- d[order(d$Days), ]
  x <- d$Reaction
  a <- psych::autoR(x)
  data.frame(
    Subject = d$Subject[1],
    mssd = psych::mssd(x),
    autoR = a$autoR,
    rssd = a$rssd,
    acf1 = acf(x, lag.max = 1, plot = FALSE)$acf[2]
  )
})
out <- do.call(rbind, rows)
write.csv(out, "expected.csv", row.names = FALSE, quote = FALSE)
writeLines(c(paste("psych", packageVersion("psych")), paste("lme4", packageVersion("lme4")), R.version.string), "versions.txt")
