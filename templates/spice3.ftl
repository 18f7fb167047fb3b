<#--
  Diode card for Berkeley SPICE3f5 (classic parameter set).
  Data: name, dialect, provenance (list of strings), parameters (list of {keyword, value}).
  Every value arrives as a finished string with its SPICE suffix; do not format numbers here.
  Only comment lines from provenance may precede .model, so that a card read back writes the same bytes.
-->
<#list provenance as line>
*<#if line?has_content> ${line}</#if>
</#list>
.model ${name} D(
<#list parameters as p>
+ ${p.keyword}=${p.value}
</#list>
+ )
