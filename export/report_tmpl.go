package export

import (
	"framecheck/export/internal/fmtx"
	"html/template"
	"strconv"
)

// reportTemplate is the page. Section ids (summary, plan, schedule,
// takeoff, uplift, calculations, mark-<mark>, assumptions, cautions) are stable:
// the tests and any reader's links use them.
var reportTemplate = template.Must(template.New("report").Funcs(template.FuncMap{"num": fmtNum, "val": fmtx.Value, "combo": fmtx.Combo, "math": mathHTML, "mathn": numHTML, "bf": boardFeet, "limit": limitText}).Parse(reportHTML))

// boardFeet prints board feet to 0.1, or "n/a".
func boardFeet(v float64) string {
	if !finite(v) {
		return "n/a"
	}
	return strconv.FormatFloat(v, 'f', 1, 64)
}

const reportCSS = `
:root{--ink:#1b1f24;--muted:#5c6570;--rule:#d5dae0;--band:#f4f6f8}
*{box-sizing:border-box}
body{font:14px/1.45 system-ui,-apple-system,"Segoe UI",Roboto,"DejaVu Sans",sans-serif;color:var(--ink);margin:0;background:#fff}
header.top{padding:14px 24px;border-bottom:3px solid var(--ink);display:flex;justify-content:space-between;align-items:baseline;flex-wrap:wrap;gap:8px}
header.top h1{font-size:20px;margin:0}
header.top .meta{color:var(--muted)}
nav.toc{padding:6px 24px;border-bottom:1px solid var(--rule);font-size:13px}
nav.toc a{margin-right:14px;color:var(--ink)}
main{padding:0 24px 40px}
section{margin-top:22px}
h2{font-size:17px;border-bottom:1px solid var(--rule);padding-bottom:3px;margin:0 0 10px}
h3{font-size:15px;margin:16px 0 6px}
table{border-collapse:collapse;margin:4px 0 10px;font-size:13px}
th,td{border:1px solid var(--rule);padding:3px 8px;text-align:left;vertical-align:top}
th{background:var(--band);font-weight:600}
td.n{text-align:right;font-variant-numeric:tabular-nums}
.sum-grid{display:grid;grid-template-columns:minmax(300px,1fr) minmax(300px,1.6fr);gap:24px;align-items:start}
h3.tight{margin-top:0}
#worst{font-size:12px}#worst td,#worst th{padding:1px 6px}
.cards{display:flex;gap:12px;flex-wrap:wrap}
.card{border:1px solid var(--rule);border-radius:4px;padding:6px 12px;min-width:84px}
.card b{display:block;font-size:22px}
.card.pass b{color:#1e7a52}.card.fail b{color:#b3261e}.card.error b{color:#6b6b6b}
.status-pass{color:#1e7a52}.status-fail{color:#b3261e;font-weight:600}.status-error{color:#6b6b6b;font-weight:600}
.sw{display:inline-block;width:26px;height:10px;border-radius:2px;vertical-align:middle;margin-right:6px}
.plan-wrap{position:relative;border:1px solid var(--rule);background:#fbfbfa}
#plan-svg{display:block;width:100%;height:min(70vh,820px);min-height:420px;cursor:grab}
#plan-svg .zone{fill:#e8eef5;fill-opacity:.55;stroke:#7d93ab;stroke-dasharray:6 4;vector-effect:non-scaling-stroke;stroke-width:1px}
#plan-svg .zone-name{fill:#7d93ab;font-weight:700;opacity:.8}
#plan-svg .support{fill:none;stroke:#3a3f45;stroke-width:4px;vector-effect:non-scaling-stroke;stroke-linecap:square}
#plan-svg .beam{stroke-width:8px;stroke-opacity:.8;vector-effect:non-scaling-stroke;stroke-linecap:butt}
#plan-svg #carried line{stroke:#000;stroke-width:6px;stroke-opacity:.5;vector-effect:non-scaling-stroke;stroke-linecap:round;pointer-events:none}
#plan-svg #beams text{fill:#222;font-weight:700;text-anchor:middle;pointer-events:none}
#plan-svg #beams .lbl-fail{fill:#b3261e}
#plan-svg .j path{fill:none;stroke-width:2px;vector-effect:non-scaling-stroke;stroke-linecap:round}
#plan-svg .j.fail path{stroke-width:5px}
#plan-svg .j.err path{stroke-width:4px;stroke-dasharray:8 5}
#plan-svg #pick{stroke:#000;stroke-width:6px;vector-effect:non-scaling-stroke;stroke-linecap:round;pointer-events:none}
#plan-svg .blk-add{stroke:#0a8fa8;stroke-width:3px;stroke-dasharray:10 4;vector-effect:non-scaling-stroke}
#plan-svg .blk-existing{stroke:#8a8f96;stroke-width:1.5px;vector-effect:non-scaling-stroke}
#plan-svg #labels text{fill:#333;pointer-events:none;text-anchor:middle}
#plan-svg #labels .lbl-fail{fill:#b3261e;font-weight:700}
#plan-svg #labels .lbl-err{fill:#555;font-weight:700}
#details{position:absolute;top:8px;right:8px;background:#fff;border:1px solid var(--rule);border-radius:4px;padding:6px 10px;font-size:12px;max-width:360px;box-shadow:0 1px 4px rgba(0,0,0,.12)}
#details:empty{display:none}
.legend{display:flex;gap:14px;flex-wrap:wrap;align-items:center;margin:8px 0;font-size:12px}
.scale{display:block;width:220px;height:12px;border:1px solid var(--rule);background:linear-gradient(90deg,#2b6cb0 0%,#1e9a6e 33.3%,#d9a41a 53.3%,#d7301f 66.7%,#6a1b9a 100%)}
.scale-ticks{display:flex;justify-content:space-between;width:220px;font-size:10px;color:var(--muted)}
.hint{color:var(--muted);font-size:12px}
.calc{border-top:2px solid var(--ink);margin-top:26px;padding-top:6px}
.calc h3{font-size:16px}
.eq{font-family:"DejaVu Sans Mono",Consolas,monospace;font-size:12.5px;margin:1px 0 1px 12px;white-space:pre-wrap}
.eq .sym{font-weight:700}
sub,sup{line-height:0;font-size:75%}
.eq .val{font-weight:700}
.eq .src{color:var(--muted);font-family:system-ui,sans-serif;font-size:11.5px;margin-left:10px}
.eq .note{color:var(--muted)}
.check{margin:8px 0 10px;padding:4px 0 6px 8px;border-left:4px solid var(--rule)}
.check.band-over{border-left-color:#b3261e}
.check h4{margin:2px 0 4px;font-size:14px}
.check h4 .clause{font-weight:400;color:var(--muted);font-size:12px;margin-left:8px}
.result{margin:3px 0 0 12px;font-weight:600}
.result.ok{color:#1e7a52}.result.ng{color:#b3261e}
.msgs{color:#b3261e}
.cautions{border:2px solid #b3261e;border-radius:4px;padding:6px 16px;background:#fff7f6}
.title-page{display:none}
.title-page h1{font-size:30px;margin:0 0 6px}
.title-page .tp-sub{font-size:18px;margin:0 0 18px}
.title-page table.tp{font-size:14px;margin-top:22px}
.title-page table.tp th{width:1.6in}
@media print{
  @page{size:letter;margin:0.55in 0.5in 0.65in;
    @bottom-right{content:"Page " counter(page) " of " counter(pages);font:8pt sans-serif;color:#444}}
  @page plan{size:letter landscape;margin:0.4in 0.4in 0.55in}
  body{font-size:10pt}
  header.top,nav.toc,#details,.hint{display:none}
  .title-page{display:block;break-after:page;padding-top:1.4in}
  .sum-grid{display:block}
  #plan{page:plan;break-before:page;break-after:page;margin-top:0}
  #plan .legend{margin:0 0 4px}
  .plan-wrap{border:none;background:none}
  #plan-svg{width:10.1in;height:6.5in;min-height:0;cursor:auto}
  h2,h3,h4{break-after:avoid;break-inside:avoid}
  tr,.eq,.result,.check,.cards,table.inputs,table.others,table.combos,table.steps{break-inside:avoid}
  .calc{break-before:page;border-top:none}
  .pkg-governing{font-size:9pt}
  .pkg-governing .calc{break-before:auto;border-top:1px solid var(--rule);padding-top:4px}
  .pkg-governing #path-beams table.sub,.pkg-governing #path-joints{display:none}
  .pkg-governing table{font-size:8pt}
  .pkg-governing th,.pkg-governing td{padding:1px 4px}
  .pkg-governing section{margin-top:12px}
  .pkg-governing #assumptions table{font-size:7pt}
  .pkg-governing #assumptions{columns:2;column-gap:16px;font-size:8pt}
  .pkg-governing #assumptions h2{column-span:all}
  .pkg-governing .calc{break-before:auto;border-top:2px solid var(--ink);margin-top:10px;font-size:8pt;line-height:1.3}
  .pkg-governing .calc h3{font-size:10.5pt;margin:2px 0 1px}
  .pkg-governing .calc h4{font-size:9pt;margin:4px 0 1px}
  .pkg-governing .calc table{font-size:8pt;margin:2px 0 4px}
  .pkg-governing .calc th,.pkg-governing .calc td{padding:1px 5px}
  .pkg-governing .calc .eq{font-size:7.5pt;margin-left:6px;line-height:1.3}
  .pkg-governing .calc .eq .src{font-size:7.5pt}
  .pkg-governing table.inputs{display:block;columns:2;column-gap:14px;border:none}
  .pkg-governing table.inputs tbody{display:block}
  .pkg-governing table.inputs tr{display:flex;break-inside:avoid}
  .pkg-governing table.inputs th{flex:0 0 40%}
  .pkg-governing table.inputs td{flex:1}
  .pkg-governing .factors{columns:2;column-gap:14px}
  .pkg-governing .factors .eq{break-inside:avoid}
  .pkg-governing .check{margin:4px 0;padding:2px 0 2px 6px;break-inside:auto}
  .pkg-governing .loads{columns:2;column-gap:14px}
  .pkg-governing #worst th:last-child,.pkg-governing #worst td:last-child{display:none}
  .pkg-governing #uplift-lines th:last-child,.pkg-governing #uplift-lines td:last-child{display:none}
  .pkg-governing ul.bracing{margin:2px 0;padding-left:16px}
  a{color:inherit;text-decoration:none}
}
`
const reportJS = `
(function(){
  var svg=document.getElementById('plan-svg'), out=document.getElementById('details');
  if(!svg) return;
  var vb=svg.viewBox.baseVal, home=[vb.x,vb.y,vb.width,vb.height], sel=null;
  function set(x,y,w,h){vb.x=x;vb.y=y;vb.width=w;vb.height=h;}
  function pt(e){var r=svg.getBoundingClientRect(),s=Math.max(vb.width/r.width,vb.height/r.height);
    return [vb.x+(e.clientX-r.left-(r.width-vb.width/s)/2)*s, vb.y+(e.clientY-r.top-(r.height-vb.height/s)/2)*s, s];}
  svg.addEventListener('wheel',function(e){e.preventDefault();var p=pt(e),k=e.deltaY<0?0.8:1.25;
    set(p[0]-(p[0]-vb.x)*k,p[1]-(p[1]-vb.y)*k,vb.width*k,vb.height*k);},{passive:false});
  var drag=null;
  svg.addEventListener('mousedown',function(e){drag=[e.clientX,e.clientY,vb.x,vb.y,pt(e)[2]];});
  window.addEventListener('mousemove',function(e){if(!drag)return;
    set(drag[2]-(e.clientX-drag[0])*drag[4],drag[3]-(e.clientY-drag[1])*drag[4],vb.width,vb.height);});
  window.addEventListener('mouseup',function(){drag=null;});
  svg.addEventListener('dblclick',function(){set(home[0],home[1],home[2],home[3]);});
  function text(tag,s){var el=document.createElement(tag);el.textContent=s;return el;}
  // Member ids and handles, written only where they break the sequence.
  var ids=[],hs=[];
  function nid(id){var k=id.search(/[0-9]+$/);return k<0?null:id.slice(0,k)+(+id.slice(k)+1);}
  function nh(h){return h===''?'':(parseInt(h,16)+1).toString(16).toUpperCase();}
  FC.m.forEach(function(e,i){ids[i]=(e.length>1&&e[1]!==0)?e[1]:nid(ids[i-1]);hs[i]=e.length>2?e[2]:nh(hs[i-1]);});
  // A path's segments (SVG frame) and members, read from its d and data-m once.
  function segs(el){if(el._s)return el._s;var t=el.getAttribute('d').match(/[a-zA-Z]|-?[0-9.]+/g)||[],
    s=[],x=0,y=0,k=0,c,sx,sy;
    while(k<t.length){c=t[k++];var a=+t[k++];
      if(c==='M'){x=a;y=+t[k++];}else if(c==='m'){x+=a;y+=+t[k++];}
      else{sx=x;sy=y;if(c==='h')x+=a;else if(c==='v')y+=a;else{x+=a;y+=+t[k++];}s.push([sx,sy,x,y]);}}
    var idx=[];el.getAttribute('data-m').split(',').forEach(function(r){var q=r.split('-'),lo=+q[0],hi=q.length>1?+q[1]:lo;
      for(var i=lo;i<=hi;i++)idx.push(i);});
    el._s={s:s,idx:idx};return el._s;}
  function member(el,e){var d=segs(el),p=pt(e),best=-1,bd=1e300;
    d.s.forEach(function(q,k){var dx=q[2]-q[0],dy=q[3]-q[1],l=dx*dx+dy*dy,
      u=l>0?Math.max(0,Math.min(1,((p[0]-q[0])*dx+(p[1]-q[1])*dy)/l)):0,ex=q[0]+u*dx-p[0],ey=q[1]+u*dy-p[1],dd=ex*ex+ey*ey;
      if(dd<bd){bd=dd;best=k;}});
    return best<0?null:{i:d.idx[best],q:d.s[best]};}
  var pick=document.getElementById('pick');
  function mark(q){pick.style.visibility=q?'visible':'hidden';if(!q)return;pick.setAttribute('x1',q[0]);pick.setAttribute('y1',q[1]);pick.setAttribute('x2',q[2]);pick.setAttribute('y2',q[3]);}
  function show(el,e,pin){var h=member(el,e);if(!h)return;var i=h.i,m=FC.m[i],g=m&&FC.g[m[0]];if(!g)return;
    if(pin){sel=h;pick.classList.add('sel');}
    mark(h.q);
    var t=FC.text,st={p:'pass',f:'fail',e:'error'}[g[5]],mk=t[g[0]],rs=[];
    g[6].forEach(function(v,k){if(v!==null)rs.push(FC.kinds[k]+' '+v.toFixed(3));});
    out.textContent='';out.setAttribute('data-member',ids[i]);
    out.appendChild(text('b',ids[i]+(mk?'  mark '+mk:'')));
    [['size',t[g[1]]],['spans',t[g[2]]],['max ratio',g[3]===null?'':g[3].toFixed(3)+(g[4]>=0?' ('+FC.kinds[g[4]]+')':'')],
     ['status',st],['ratios',rs.join(', ')],['handle',hs[i]]]
      .forEach(function(r){if(r[1]){out.appendChild(document.createElement('br'));out.appendChild(text('span',r[0]+': '+r[1]));}});
    if(mk){var a=document.createElement('a');a.href='#mark-'+mk.replace(/[^A-Za-z0-9_-]/g,'_');a.textContent='calculation';
      out.appendChild(document.createElement('br'));out.appendChild(a);}
  }
  function isJ(el){return el.tagName==='path'&&el.parentNode.classList.contains('j');}
  function isB(el){return el.tagName==='line'&&el.classList.contains('beam');}
  // The load-path view: a clicked beam's details, and the members it
  // carries drawn over the plan (their segments found by id once).
  var carried=document.getElementById('carried'),segOf=null;
  function memberSegs(){if(segOf)return segOf;segOf={};
    svg.querySelectorAll('#members g.j path').forEach(function(p){var d=segs(p);d.idx.forEach(function(i,k){segOf[ids[i]]=d.s[k];});});
    return segOf;}
  function unbeam(){if(carried)carried.textContent='';out.removeAttribute('data-beam');}
  function showBeam(el){unbeam();mark(null);sel={beam:el};var so=memberSegs(),n=0,
    ms=(el.getAttribute('data-carries')||'').split(' ').filter(function(s){return s!=='';});
    ms.forEach(function(id){var q=so[id];if(!q||!carried)return;
      var l=document.createElementNS('http://www.w3.org/2000/svg','line');
      l.setAttribute('x1',q[0]);l.setAttribute('y1',q[1]);l.setAttribute('x2',q[2]);l.setAttribute('y2',q[3]);
      carried.appendChild(l);n++;});
    out.textContent='';out.removeAttribute('data-member');out.setAttribute('data-beam',el.getAttribute('data-beam'));
    var t=el.querySelector('title'),parts=t?t.textContent.split('; '):[];
    out.appendChild(text('b',parts.length?parts[0]:el.getAttribute('data-beam')));
    parts.slice(1).forEach(function(s){out.appendChild(document.createElement('br'));out.appendChild(text('span',s));});
    out.appendChild(document.createElement('br'));out.appendChild(text('span',n+' member(s) it carries shown on the plan'));
    var a=document.createElement('a');a.href='#loadpath';a.textContent='load path';
    out.appendChild(document.createElement('br'));out.appendChild(a);}
  svg.addEventListener('mousemove',function(e){if(!drag&&!sel&&isJ(e.target))show(e.target,e,false);});
  svg.addEventListener('click',function(e){if(isJ(e.target)){unbeam();show(e.target,e,true);}
    else if(isB(e.target))showBeam(e.target);
    else if(sel){sel=null;pick.classList.remove('sel');mark(null);unbeam();out.textContent='';}});
})();
`

const reportHTML = `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>{{.Title}}</title>
<style>` + reportCSS + `</style>
<style>@media print{@page{@bottom-left{content:"{{.Footer}}";font:8pt sans-serif;color:#444}}}</style>
</head>
<body{{if .Governing}} class="pkg-governing"{{end}}>
<section id="title-page" class="title-page">
<h1>{{if .ProjectName}}{{.ProjectName}}{{else}}Joist check{{end}}</h1>
<p class="tp-sub">Wood joist calculations, NDS 2018 ASD: {{.Plan}}</p>
<table class="tp">{{range .Project}}<tr><th>Project</th><td>{{.}}</td></tr>{{end}}
<tr><th>Plan</th><td>{{.Plan}}</td></tr>
<tr><th>Checked</th><td>{{.Date}}</td></tr>
<tr><th>Design basis</th><td>{{range $i, $e := .Editions}}{{if $i}}; {{end}}{{$e}}{{end}}</td></tr>
<tr><th>Result</th><td>{{.Summary.Members}} members: {{.Summary.Pass}} pass, {{.Summary.Fail}} fail, {{.Summary.Error}} in error</td></tr>
<tr><th>Calculation package</th><td>{{if .Governing}}governing check of each mark written out, the others tabulated{{else}}every check of each mark written out{{end}}</td></tr>
<tr><th>Tool</th><td>framecheck {{.Version}}</td></tr></table>
<p class="tp-caution">{{range .Cautions}}{{.}} {{end}}</p>
</section>
<header class="top"><h1>{{if .ProjectName}}{{.ProjectName}}: {{end}}Joist check: {{.Plan}}</h1>
<div class="meta">{{range .Project}}{{.}} · {{end}}framecheck {{.Version}} · {{.Date}}</div></header>
<nav class="toc"><a href="#summary">Summary</a><a href="#plan">Plan</a><a href="#schedule">Schedule</a><a href="#takeoff">Takeoff</a><a href="#uplift">Uplift</a>{{if .Path}}<a href="#loadpath">Load path</a>{{end}}<a href="#calculations">Calculations</a><a href="#assumptions">Assumptions</a><a href="#cautions">Cautions</a></nav>
<main>
<section id="summary"><h2>Summary</h2>
<div class="sum-grid"><div>
<p>Plan <b>{{.Plan}}</b>, checked {{.Date}}.<br>Design basis: {{range $i, $e := .Editions}}{{if $i}}; {{end}}{{$e}}{{end}}.<br>
Positions along a member are measured from the face of its first bearing (the side toward the span), in feet-inches; locations are plan coordinates in feet-inches.</p>
<div class="cards">
<div class="card"><b>{{.Summary.Members}}</b>members</div>
<div class="card pass"><b>{{.Summary.Pass}}</b>pass</div>
<div class="card fail"><b>{{.Summary.Fail}}</b>fail</div>
<div class="card error"><b>{{.Summary.Error}}</b>error</div>
<div class="card"><b>{{len .Marks}}</b>marks</div>
</div>
</div>
<div><h3 class="tight">Worst members, one per mark</h3>
<table id="worst"><tr><th>member</th><th>mark</th><th>count</th><th>size</th><th>max ratio</th><th>governing check</th><th>status</th><th>location on the plan</th></tr>
{{range .Worst}}<tr><td>{{.ID}}</td><td>{{.Mark}}</td><td class="n">{{.Count}}</td><td>{{.Size}}</td><td class="n">{{.Ratio}}</td><td>{{.Governing}}</td><td class="status-{{.Status}}">{{.Status}}</td><td>{{.Source}}</td></tr>
{{end}}</table>
</div></div>
</section>

{{if not .Governing}}{{template "plansec" .}}{{end}}

{{if .ErrorRows}}<section id="errors-list"><h2>Members in error (not checked)</h2>
<table id="errors"><tr><th>member</th><th>drawn</th><th>why</th></tr>
{{range .ErrorRows}}<tr><td>{{.ID}}</td><td>{{.Source}}</td><td>{{range $i, $m := .Messages}}{{if $i}}<br>{{end}}{{$m}}{{end}}</td></tr>
{{end}}</table>{{if .MoreErrors}}<p>and {{.MoreErrors}} more members in error (see results.json).</p>{{end}}
</section>{{end}}

<section id="schedule"><h2>Framing schedule</h2>
<table><tr><th>mark</th><th>size</th><th>species</th><th>grade</th><th>zone</th><th>spacing</th><th>spans</th><th>count</th><th>blocking rows per span</th><th>max ratio</th><th>status</th></tr>
{{range .Marks}}<tr class="{{.Band}}"><td><a href="#{{.Anchor}}">{{.Mark}}</a></td><td>{{.Size}}</td><td>{{.Species}}</td><td>{{.Grade}}</td><td>{{.Zone}}</td><td class="n">{{.Spacing}}</td><td>{{.Spans}}</td><td class="n">{{.Count}}</td><td class="n">{{.Rows}}</td><td class="n">{{.Ratio}}</td><td class="status-{{.Status}}">{{.Status}}</td></tr>
{{end}}</table>
</section>

<section id="takeoff"><h2>Takeoff</h2>
<table><tr><th>item</th><th>size</th><th>order length</th><th>count</th><th>board feet</th><th>note</th></tr>
{{range .Takeoff.Joists}}<tr><td>joist</td><td>{{.Size}}</td><td class="n">{{num .OrderLengthFt}} ft</td><td class="n">{{.Count}}</td><td class="n">{{bf .BoardFeet}}</td><td>{{.Note}}</td></tr>
{{end}}{{range .Takeoff.Blocking}}<tr><td>blocking</td><td>{{.Size}}</td><td></td><td class="n">{{.Count}}</td><td class="n">{{bf .BoardFeet}}</td><td>{{.Note}}</td></tr>
{{end}}{{range .Takeoff.Hangers}}<tr><td>hanger</td><td>{{.Size}}</td><td></td><td class="n">{{.Count}}</td><td></td><td>{{.Note}}</td></tr>
{{end}}</table>
<table id="totals"><tr><th>joists</th><th>joist board feet</th><th>blocking pieces</th><th>blocking board feet</th><th>hangers</th><th>total board feet</th></tr>
<tr><td class="n">{{.Totals.JoistCount}}</td><td class="n">{{bf .Totals.JoistBoardFeet}}</td><td class="n">{{.Totals.BlockingPieces}}</td><td class="n">{{bf .Totals.BlockingBoardFeet}}</td><td class="n">{{.Totals.Hangers}}</td><td class="n">{{bf .Totals.BoardFeet}}</td></tr></table>
</section>

<section id="uplift"><h2>Uplift at the bearings (connector demand)</h2>
{{if .Uplift.Count}}<p>{{.Uplift.Count}} bearing{{if ne .Uplift.Count 1}}s{{end}} have a net uplift reaction under some load combination;
{{.Uplift.Flagged}} with {{.Uplift.ReportLb}} lb or more (design.uplift_report_lb) are flagged, and labelled on layer FC-UPLIFT of the annotated drawing; smaller uplift is listed, not flagged.
Reactions are at ASD level (ASCE 7-16 2.4.1 combinations), by statics of each member as analysed.
At each flagged bearing a connector is needed whose allowable load for the combination's load duration (CD, NDS 2018 Table 2.3.2: 1.6 for wind) is at least the uplift shown; the designer picks the part.</p>
<h3>By support line</h3>
<table id="uplift-lines"><tr><th>support line</th><th>kind</th><th>bearings with uplift</th><th>flagged</th><th>largest, lb</th><th>total, lb</th><th>required connector capacity per bearing, ASD, lb</th><th>CD</th><th>combination</th><th>members</th></tr>
{{range .Uplift.Lines}}<tr><td>{{.Support}}</td><td>{{.Kind}}</td><td class="n">{{.Count}}</td><td class="n">{{.Flagged}}</td><td class="n">{{.Max}}</td><td class="n">{{.Total}}</td><td class="n">{{.Need}}</td><td class="n">{{.CD}}</td><td>{{combo .Combo}}</td><td>{{.Members}}</td></tr>
{{end}}</table>
{{if .Uplift.Rows}}<h3>By bearing</h3>
<table id="uplift-bearings"><tr><th>member</th><th>mark</th><th>support line (bearing)</th><th>at, from face of first bearing</th><th>uplift, lb (ASD)</th><th>combination</th><th>CD</th><th></th></tr>
{{range .Uplift.Rows}}<tr><td>{{.Member}}</td><td>{{.Mark}}</td><td>{{.Support}}</td><td class="n">{{.At}}</td><td class="n">{{if .Flagged}}<b>{{.Uplift}}</b>{{else}}{{.Uplift}}{{end}}</td><td>{{combo .Combo}}</td><td class="n">{{.CD}}</td><td>{{if .Flagged}}flagged{{else}}listed{{end}}</td></tr>
{{end}}</table>{{end}}{{if .Uplift.More}}<p>and {{.Uplift.More}} more bearings with uplift (see results.json, "uplift").</p>{{end}}
{{else}}<p>No bearing has a net uplift reaction under any load combination.</p>{{end}}
</section>
{{with .Path}}<section id="loadpath"><h2>Load path: beams, posts, connections, foundation</h2>
<p>{{.Summary}}. Each beam is checked with the reactions of the members it carries, by load type, as point loads where they bear, and its own weight; it forms its own load combinations. The loads put on the members of the path reach walls, posts and rigid supports in full: {{.Balance}}. Beams that pass share a row by mark (alike in size, lumber, spans and ratio within 0.01) with the checks of its beam of largest ratio, and posts and foundation loads alike but for their id share a row; a beam or post that does not pass (or a beam with a message) has its own. Every beam, post and foundation line is in the Beams, Posts and Foundation sheets and results.json.</p>
<h3>Beams</h3>
<table id="path-beams"><tr><th>beams</th><th>mark</th><th>count</th><th>kind</th><th>size</th><th>spans</th><th>bears on</th><th>carries</th><th>governing</th><th>ratio</th><th>status</th></tr>
{{range .Beams}}<tr{{if .Bad}} class="bad"{{end}}><td>{{.IDs}}</td><td>{{.Mark}}</td><td class="n">{{.Count}}</td><td>{{.Kind}}</td><td>{{.Size}}</td><td>{{.Spans}}</td><td>{{.Supports}}</td><td>{{.Carries}}</td><td>{{.Governing}}</td><td class="n">{{.Ratio}}</td><td>{{.Status}}</td></tr>
{{if .Checks}}<tr><td></td><td colspan="10"><table class="sub">{{if .Of}}<caption>checks of {{.Of}}, the largest ratio of the mark</caption>{{end}}{{range .Checks}}<tr><td>{{.Kind}}</td><td>{{combo .Combo}}</td><td class="n">{{.Actual}}</td><td class="n">{{.Allowable}}</td><td>{{.Unit}}</td><td class="n">{{.Ratio}}</td></tr>{{end}}</table></td></tr>{{end}}
{{if .Messages}}<tr><td></td><td colspan="10">{{.Messages}}</td></tr>{{end}}
{{end}}</table>
{{if .Posts}}<h3>Posts</h3>
<table id="path-posts"><tr><th>posts</th><th>count</th><th>size</th><th>D, lb</th><th>L, lb</th><th>Lr, lb</th><th>S, lb</th><th>largest down, ASD lb</th><th>net uplift, ASD lb</th><th>column ratio</th><th>status</th></tr>
{{range .Posts}}<tr{{if .Bad}} class="bad"{{end}}><td>{{.IDs}}</td><td class="n">{{.Count}}</td><td>{{.Size}}</td><td class="n">{{.D}}</td><td class="n">{{.L}}</td><td class="n">{{.Lr}}</td><td class="n">{{.S}}</td><td class="n">{{.Down}}</td><td class="n">{{.Up}}</td><td class="n">{{.Ratio}}</td><td>{{.Status}}</td></tr>
{{end}}</table>{{end}}
<h3>Connections (ASD demand; no product named)</h3>
<table id="path-joints"><tr><th>joint</th><th>count</th><th>largest down, lb</th><th>at</th><th>largest up, lb</th><th>at</th></tr>
{{range .Joints}}<tr><td>{{.Kind}}</td><td class="n">{{.Count}}</td><td class="n">{{.Down}}</td><td>{{.DownAt}}</td><td class="n">{{.Up}}</td><td>{{.UpAt}}</td></tr>
{{end}}</table>
<h3>Loads to the foundation</h3>
<table id="path-foundation"><tr><th>kind</th><th>ids</th><th>count</th><th>D</th><th>L</th><th>Lr</th><th>S</th><th>W down</th><th>W up</th><th>unit</th></tr>
{{range .Foundation}}<tr><td>{{.Kind}}</td><td>{{.IDs}}</td><td class="n">{{.Count}}</td><td class="n">{{.D}}</td><td class="n">{{.L}}</td><td class="n">{{.Lr}}</td><td class="n">{{.S}}</td><td class="n">{{.Wd}}</td><td class="n">{{.Wu}}</td><td>{{.Unit}}</td></tr>
{{end}}</table>
<p>Every connection's demand by load type and combination is in the Connections sheet and results.json ("load_path").</p>
</section>{{end}}
{{if .Governing}}{{template "plansec" .}}{{end}}

<section id="calculations"><h2>Calculations by mark</h2>
<p>Each mark is calculated for its governing member (largest ratio); the other members of the mark are identical for design.</p>
{{if .Covered}}<p>Not written out here: marks whose every check ratio is at or below that of a mark of the same size, lumber, zone, spans and blocking that is written out (a joist at the edge of its run, say, carrying less). Their numbers are in the Members sheet and results.json; run without <code>--package governing</code> to write them out.</p>
<table id="covered"><tr><th>mark</th><th>members</th><th>max ratio</th><th>covered by</th></tr>
{{range .Covered}}<tr><td>{{.Mark}}</td><td class="n">{{.Count}}</td><td class="n">{{.Ratio}}</td><td>{{.By}}</td></tr>
{{end}}</table>{{end}}
{{range .Calcs}}<article class="calc" id="{{.Anchor}}" data-mark="{{.Mark}}" data-member="{{.Member}}">
<h3>Mark {{.Mark}}: {{.Count}} member{{if ne .Count 1}}s{{end}}, max ratio {{.Ratio}}, <span class="status-{{.Status}}">{{.Status}}</span></h3>
<p class="hint">Members: {{range $i, $m := .Members}}{{if $i}}, {{end}}{{$m}}{{end}}{{if .MoreMembers}} and {{.MoreMembers}} more{{end}}.</p>
{{if .Messages}}<p class="msgs">{{range .Messages}}{{.}}<br>{{end}}</p>{{end}}
<h4>Inputs</h4>
<table class="inputs">{{range .Inputs}}<tr><th>{{.Key}}</th><td>{{.Value}}</td></tr>{{end}}</table>
{{if .Bracing}}<h4>Bracing relied on</h4><ul class="bracing">{{range .Bracing}}<li>{{.}}</li>{{end}}</ul>{{end}}
{{if .DesignValues}}<h4>Reference design values</h4>
<table><tr><th>value</th><th></th><th>size</th><th>source</th></tr>{{range .DesignValues}}<tr><td>{{.Name}}</td><td class="n">{{val .Value .Unit}} {{.Unit}}</td><td>{{.Size}}</td><td>{{.Source}}</td></tr>{{end}}</table>{{end}}
{{if .AreaLoads}}<h4>Loads on the tributary width</h4>
<div class="loads">{{range .AreaLoads}}<div class="eq"><span class="sym">w<sub>{{.Load}}</sub></span> = p trib = {{.Subst}} = <span class="val">{{.WPlf}}</span> plf</div>{{end}}</div>{{end}}
{{if .PointLoads}}<h4>Point loads</h4>
<p>Positions from the face of the first bearing; each combination takes them by load type with the same factors as the loads on the tributary width.</p>
<ul class="loads">{{range .PointLoads}}<li>{{.}}</li>{{end}}</ul>{{end}}
{{if .Combos}}<h4>Load combinations (ASCE 7-16 2.4.1, ASD)</h4>
{{if .PointLoads}}<table class="combos"><tr><th>combination</th><th>case</th><th>w = sum of factor x w</th><th>w, plf</th><th>P = sum of factor x P</th><th>P, lb</th><th>CD (NDS 2018 Table 2.3.2)</th></tr>
{{range .Combos}}<tr><td>{{combo .Combo}}</td><td>{{.Case}}</td><td>{{.Subst}}</td><td class="n">{{.WPlf}}</td><td>{{.PSubst}}</td><td class="n">{{.PLb}}</td><td class="n">{{.CD}}</td></tr>{{end}}</table>
{{else}}<table class="combos"><tr><th>combination</th><th>case</th><th>w = sum of factor x w</th><th>w, plf</th><th>CD (NDS 2018 Table 2.3.2)</th></tr>
{{range .Combos}}<tr><td>{{combo .Combo}}</td><td>{{.Case}}</td><td>{{.Subst}}</td><td class="n">{{.WPlf}}</td><td class="n">{{.CD}}</td></tr>{{end}}</table>{{end}}{{end}}
{{range .ComboProblems}}<p class="msgs">{{.}}</p>{{end}}
{{if .FactorLine}}<p class="fline"><b>Adjustment factors:</b> {{.FactorLine}}</p>{{end}}
{{if .Factors}}<h4>Adjustment factors</h4>
<div class="factors">{{range .Factors}}{{template "line" .}}{{end}}</div>{{end}}
<h4>{{if $.Governing}}Governing check{{else}}Checks{{end}}</h4>
{{range .Checks}}<div class="check {{.Band}}" data-kind="{{.Kind}}"><h4>{{.Title}}, {{combo .Combo}}<span class="clause">{{.Clause}}</span></h4>
{{range .Lines}}{{template "line" .}}{{end}}
<div class="result {{if eq .Verdict "OK"}}ok{{else}}ng{{end}}">{{.Actual}} {{mathn .Unit}} / {{.Allowable}} {{mathn .Unit}} = <span class="ratio">{{.Ratio}}</span> {{if eq .Verdict "OK"}}&le; 1.000{{else}}&gt; 1.000{{end}}: {{.Verdict}}</div>
{{range .After}}<p class="hint alt-rule">{{.}}</p>{{end}}</div>
{{end}}
{{if .Others}}<h4>Other checks (not governing)</h4>
<table class="others"><tr><th>check</th><th>combination</th><th>actual</th><th>allowable</th><th>ratio</th><th></th></tr>
{{range .Others}}<tr><td>{{.Title}}</td><td>{{combo .Combo}}</td><td class="n">{{.Actual}} {{.Unit}}</td><td class="n">{{.Allowable}} {{.Unit}}</td><td class="n">{{.Ratio}}</td><td>{{.Verdict}}</td></tr>{{end}}</table>{{end}}
{{if .Steps}}{{if .StepsDrawn}}<h4>Blocking rows: bottom-edge bending with the drawn rows, then each row added where the edge still failed (CL by NDS 2018 3.3.3)</h4>
<table class="steps"><tr><th>rows added</th><th>lu, in</th><th>CL</th><th>ratio</th><th></th><th>rows added at, from face of first bearing</th></tr>
{{range .Steps}}<tr><td class="n">{{.Rows}}</td><td class="n">{{.Lu}}</td><td class="n">{{.CL}}</td><td class="n">{{.Ratio}}</td><td>{{.Verdict}}</td><td>{{.At}}</td></tr>{{end}}</table>{{else}}<h4>Blocking rows: bottom-edge bending for each number of rows tried (rows evenly spaced in every span; CL by NDS 2018 3.3.3)</h4>
<table class="steps"><tr><th>rows per span</th><th>lu, in</th><th>CL</th><th>ratio</th><th></th></tr>
{{range .Steps}}<tr><td class="n">{{.Rows}}</td><td class="n">{{.Lu}}</td><td class="n">{{.CL}}</td><td class="n">{{.Ratio}}</td><td>{{.Verdict}}</td></tr>{{end}}</table>{{end}}{{end}}
</article>
{{end}}</section>

<section id="assumptions"><h2>Assumptions</h2>
<h3>Code editions</h3><ul>{{range .Assumptions.CodeEditions}}<li>{{.}}</li>{{end}}</ul>
<h3>Load combinations</h3><ul>{{range .Combos}}<li>{{combo .}}</li>{{end}}</ul>
{{if .Assumptions.Zones}}<h3>Load zones</h3>
<table><tr><th>zone</th><th>use</th><th>D psf</th><th>L psf</th><th>Lr psf</th><th>S psf</th><th>W down psf</th><th>W up psf</th><th>ceiling</th><th>live limit</th><th>total limit</th></tr>
{{range .Assumptions.Zones}}<tr><td>{{.Name}}</td><td>{{.Use}}</td><td class="n">{{num .DeadPsf}}</td><td class="n">{{num .LivePsf}}</td><td class="n">{{num .RoofLivePsf}}</td><td class="n">{{num .SnowPsf}}</td><td class="n">{{num .WindDownPsf}}</td><td class="n">{{num .WindUpPsf}}</td><td>{{.Ceiling}}</td><td class="n">{{limit .LiveDeflectionLimit}}</td><td class="n">{{limit .TotalDeflectionLimit}}</td></tr>
{{end}}</table>{{end}}
{{if .Assumptions.Switches}}<h3>Settings</h3>
<table><tr><th>setting</th><th>value</th><th>from</th></tr>{{range .Assumptions.Switches}}<tr><td>{{.Name}}</td><td>{{.Value}} {{.Unit}}</td><td>{{.Source}}</td></tr>{{end}}</table>{{end}}
{{if .Assumptions.DesignValues}}<h3>Design values used</h3>
<table><tr><th>species</th><th>grade</th><th>size</th><th>value</th><th></th><th>source</th></tr>{{range .Assumptions.DesignValues}}<tr><td>{{.Species}}</td><td>{{.Grade}}</td><td>{{.Size}}</td><td>{{.Name}}</td><td class="n">{{val .Value .Unit}} {{.Unit}}</td><td>{{.Source}}</td></tr>{{end}}</table>{{end}}
{{if .Assumptions.Notes}}<h3>Notes</h3><ul>{{range .Assumptions.Notes}}<li>{{.}}</li>{{end}}</ul>{{end}}
</section>

<section id="cautions" class="cautions"><h2>Cautions</h2><ul>{{range .Cautions}}<li>{{.}}</li>{{end}}</ul></section>
</main>
<script>const FC = {{.MemberJSON}};` + reportJS + `</script>
</body>
</html>
{{define "plansec"}}<section id="plan"><h2>Plan: members coloured by their largest ratio</h2>
<div class="legend"><span><span class="scale"></span><span class="scale-ticks"><span>0</span><span>0.5</span><span>0.8</span><span>1.0</span><span>1.5</span></span></span>
{{range .Legend}}<span class="{{.Class}}"><span class="sw" style="background:{{.Colour}}"></span>{{.Label}}</span>{{end}}
<span><span class="sw" style="background:#0a8fa8;height:3px"></span>blocking row to add</span>
<span><span class="sw" style="background:#3a3f45;height:4px"></span>support</span>{{if .Path}}
<span><span class="sw" style="background:linear-gradient(90deg,#2b6cb0,#d9a41a,#6a1b9a);height:8px;opacity:.8"></span>beam of the load path, coloured by its largest ratio (its title lists what it bears on and carries)</span>{{end}}</div>
<div class="plan-wrap">{{.PlanSVG}}<div id="details"></div></div>
<p class="hint">North is up. Scroll to zoom, drag to pan, double-click to reset; hover or click a member for its details.</p>
</section>{{end}}
{{define "line"}}<div class="eq"><span class="sym">{{math .Name}}</span>{{if .Formula}} = <span class="f">{{math .Formula}}</span>{{end}}{{if .Subst}} = <span class="s">{{mathn .Subst}}</span>{{end}} = <span class="val">{{.Value}}</span>{{if .Unit}} <span class="u">{{mathn .Unit}}</span>{{end}}{{if .Note}} <span class="note">({{.Note}})</span>{{end}}{{if .Source}}<span class="src">{{.Source}}</span>{{end}}</div>{{end}}`
