# Expected values for test/reference/sleepstudy.test.ts.
# Run from this folder:  Rscript make-expected.R
# Needs Debian r-base-core and r-cran-lme4. Writes sleepstudy.csv (the data lme4 ships:
# Belenky et al. 2003, J Sleep Res 12:1-12) and expected-lmer-reml.csv (lme4 fit of
# Reaction ~ Days + (1 | Subject) by REML).
suppressPackageStartupMessages(library(lme4))
data(sleepstudy, package = "lme4")
write.csv(sleepstudy[, c("Subject", "Days", "Reaction")], "sleepstudy.csv", row.names = FALSE, quote = FALSE)

fit <- lmer(Reaction ~ Days + (1 | Subject), data = sleepstudy, REML = TRUE)
vc <- as.data.frame(VarCorr(fit))
se <- sqrt(diag(as.matrix(vcov(fit))))
wald <- confint(fit, method = "Wald", level = 0.95)
out <- data.frame(
  quantity = c("intercept", "days", "se_intercept", "se_days",
               "var_subject", "var_residual", "reml_criterion",
               "wald_low_intercept", "wald_high_intercept", "wald_low_days", "wald_high_days"),
  value = c(fixef(fit)[["(Intercept)"]], fixef(fit)[["Days"]], se[[1]], se[[2]],
            vc$vcov[vc$grp == "Subject"], vc$vcov[vc$grp == "Residual"], REMLcrit(fit),
            wald["(Intercept)", 1], wald["(Intercept)", 2], wald["Days", 1], wald["Days", 2])
)
out$value <- sprintf("%.12g", out$value)
write.csv(out, "expected-lmer-reml.csv", row.names = FALSE, quote = FALSE)
writeLines(c(paste("R", R.version$major, R.version$minor), paste("lme4", packageVersion("lme4"))), "versions.txt")
