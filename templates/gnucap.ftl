<#--
  Diode card for gnucap 2017.10.03: model type written in lower case, "d", with a space before the
  parenthesis, as gnucap's own listing writes it; no inline comments (gnucap 2017 misreads them).
  Data: name, dialect, provenance (list of strings), parameters (list of {keyword, value}).
  Every value arrives as a finished string with its SPICE suffix; do not format numbers here.
  Values arrive in gnucap's meaning (Dialect.toCard): xti is the fitted XTI divided by N, because gnucap
  raises T/TNOM to XTI where ngspice raises it to XTI/N. See docs/dialects.md.
  Only comment lines from provenance may precede .model, so that a card read back writes the same bytes.
-->
<#list provenance as line>
*<#if line?has_content> ${line}</#if>
</#list>
.model ${name} d (
<#list parameters as p>
+ ${p.keyword?lower_case}=${p.value}
</#list>
+ )
